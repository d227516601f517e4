import { labParams } from '#shared/schemas/labs'
import { listReleased } from '../../../../services/releases'
import { requireLabPermission } from '../../../../utils/access'
import { validParams } from '../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  return listReleased(caller)
})
