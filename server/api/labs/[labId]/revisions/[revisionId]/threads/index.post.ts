import { revisionParams } from '#shared/schemas/designs'
import { threadCreate } from '#shared/schemas/review'
import { createThread } from '../../../../../../services/comments'
import { requireLabPermission } from '../../../../../../utils/access'
import { validBody, validParams } from '../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'review:comment')
  const body = await validBody(event, threadCreate)
  setResponseStatus(event, 201)
  return createThread(caller, revisionId, body)
})
