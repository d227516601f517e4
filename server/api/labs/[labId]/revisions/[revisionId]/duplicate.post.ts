import { duplicateBody, revisionParams } from '#shared/schemas/designs'
import { duplicateRevision } from '../../../../../services/duplicate'
import { requireLabPermission, requireSession } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const source = requireLabPermission(event, labId, 'designs:view')
  const body = await validBody(event, duplicateBody)
  setResponseStatus(event, 201)
  return duplicateRevision(requireSession(event), source, revisionId, body)
})
