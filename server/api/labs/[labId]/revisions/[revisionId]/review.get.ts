import { revisionParams } from '#shared/schemas/designs'
import { getReviewState } from '../../../../../services/reviewState'
import { requireLabPermission } from '../../../../../utils/access'
import { validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  return getReviewState(caller, revisionId)
})
