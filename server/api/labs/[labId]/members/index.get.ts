import { labParams } from '#shared/schemas/labs'
import { listMembers } from '../../../../services/members'
import { requireLabPermission } from '../../../../utils/access'
import { validParams } from '../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'members:view')
  return listMembers(caller)
})
