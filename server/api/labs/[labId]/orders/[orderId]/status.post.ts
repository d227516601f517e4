import { orderMove, orderParams } from '#shared/schemas/orders'
import { moveOrder } from '../../../../../services/orders'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, orderId } = validParams(event, orderParams)
  const caller = requireLabPermission(event, labId, 'fabrication:report')
  return moveOrder(caller, orderId, await validBody(event, orderMove))
})
