import { threadParams, threadUpdate } from '#shared/schemas/review'
import { setResolved } from '../../../../../../../services/comments'
import { requireLabPermission } from '../../../../../../../utils/access'
import { validBody, validParams } from '../../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId, threadId } = validParams(event, threadParams)
  const caller = requireLabPermission(event, labId, 'review:comment')
  const { resolved } = await validBody(event, threadUpdate)
  return setResolved(caller, revisionId, threadId, resolved)
})
