import { revisionParams } from '#shared/schemas/designs'
import { verdictBody } from '#shared/schemas/review'
import { giveVerdict } from '../../../../../services/review'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'review:verdict')
  const { verdict, note } = await validBody(event, verdictBody)
  return giveVerdict(caller, revisionId, verdict, note)
})
