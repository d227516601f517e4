import { labParams } from '#shared/schemas/labs'
import { reviewInbox } from '../../../services/reviewInbox'
import { requireLabPermission } from '../../../utils/access'
import { validParams } from '../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'lab:view')
  return reviewInbox(caller)
})
