import { labParams } from '#shared/schemas/labs'
import { labOutbox, requireOutbox } from '../../../services/outbox'
import { requireLabPermission } from '../../../utils/access'
import { validParams } from '../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'members:manage')
  requireOutbox()
  return labOutbox(caller)
})
