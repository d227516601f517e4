import { z } from 'zod'
import { asBuiltParams } from '#shared/schemas/asBuilt'
import { readAsBuiltFile } from '../../../../../../../../services/asBuiltFiles'
import { requireLabPermission } from '../../../../../../../../utils/access'
import { validParams } from '../../../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId, asBuiltId, fileId } = validParams(
    event,
    asBuiltParams.extend({ fileId: z.uuid('File id must be a UUID') }),
  )
  const caller = requireLabPermission(event, labId, 'released:view')
  const file = await readAsBuiltFile(caller, revisionId, asBuiltId, fileId)
  setResponseHeader(event, 'content-type', file.contentType)
  setResponseHeader(event, 'content-disposition', `attachment; filename="${file.fileName.replace(/[^\w.-]+/g, '_')}"`)
  return file.bytes
})
