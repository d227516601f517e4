import { orderMessage, orderParams } from '#shared/schemas/orders'
import { postOrderMessage } from '../../../../../services/orders'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, orderId } = validParams(event, orderParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  const { body } = await validBody(event, orderMessage)
  setResponseStatus(event, 201)
  return postOrderMessage(caller, orderId, body)
})
