import { commentCreate, threadParams } from '#shared/schemas/review'
import { reply } from '../../../../../../../services/comments'
import { requireLabPermission } from '../../../../../../../utils/access'
import { validBody, validParams } from '../../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId, threadId } = validParams(event, threadParams)
  const caller = requireLabPermission(event, labId, 'review:comment')
  const { body } = await validBody(event, commentCreate)
  setResponseStatus(event, 201)
  return reply(caller, revisionId, threadId, body)
})
