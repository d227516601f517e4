import { memberParams, memberRoleUpdate } from '#shared/schemas/labs'
import { changeRole } from '../../../../services/members'
import { requireLabPermission } from '../../../../utils/access'
import { validBody, validParams } from '../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, userId } = validParams(event, memberParams)
  const caller = requireLabPermission(event, labId, 'members:manage')
  const { role } = await validBody(event, memberRoleUpdate)
  return changeRole(caller, userId, role)
})
