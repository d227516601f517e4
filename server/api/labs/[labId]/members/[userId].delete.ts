import { memberParams } from '#shared/schemas/labs'
import { removeMember } from '../../../../services/members'
import { requireLabPermission } from '../../../../utils/access'
import { validParams } from '../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, userId } = validParams(event, memberParams)
  const caller = requireLabPermission(event, labId, 'members:manage')
  await removeMember(caller, userId)
  setResponseStatus(event, 204)
  return null
})
