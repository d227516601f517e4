import { maskExportParams } from '#shared/schemas/designs'
import { maskExportFile } from '../../../../../../../services/maskExports'
import { requireLabPermission } from '../../../../../../../utils/access'
import { validParams } from '../../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId, exportId } = validParams(event, maskExportParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  const { filename, body } = await maskExportFile(caller, revisionId, exportId)
  setResponseHeaders(event, {
    'content-type': 'application/dxf; charset=utf-8',
    'content-disposition': `attachment; filename="${filename}"`,
  })
  return body
})
