import { revisionParams } from '#shared/schemas/designs'
import { reviewRequestBody } from '#shared/schemas/review'
import { requestReview } from '../../../../../services/review'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'designs:edit')
  const { reviewerIds } = await validBody(event, reviewRequestBody)
  return requestReview(caller, revisionId, reviewerIds)
})
