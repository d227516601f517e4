import { designParams, revisionCreate } from '#shared/schemas/designs'
import { createRevision } from '../../../../../../services/revisions'
import { requireLabPermission } from '../../../../../../utils/access'
import { validBody, validParams } from '../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, designId } = validParams(event, designParams)
  const caller = requireLabPermission(event, labId, 'designs:edit')
  const body = await validBody(event, revisionCreate)
  setResponseStatus(event, 201)
  return createRevision(caller, designId, body)
})
