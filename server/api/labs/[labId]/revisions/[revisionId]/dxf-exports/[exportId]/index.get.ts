import { maskExportParams } from '#shared/schemas/designs'
import { maskExport } from '../../../../../../../services/maskExports'
import { requireLabPermission } from '../../../../../../../utils/access'
import { validParams } from '../../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId, exportId } = validParams(event, maskExportParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  return maskExport(caller, revisionId, exportId)
})
