import { orderParams } from '#shared/schemas/orders'
import { getOrder } from '../../../../../services/orders'
import { requireLabPermission } from '../../../../../utils/access'
import { validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, orderId } = validParams(event, orderParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  return getOrder(caller, orderId)
})
