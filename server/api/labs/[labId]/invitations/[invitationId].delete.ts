import { invitationParams } from '#shared/schemas/invitations'
import { revokeInvitation } from '../../../../services/invitations'
import { requireLabPermission } from '../../../../utils/access'
import { validParams } from '../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, invitationId } = validParams(event, invitationParams)
  const caller = requireLabPermission(event, labId, 'members:manage')
  await revokeInvitation(caller, invitationId)
  setResponseStatus(event, 204)
  return null
})
