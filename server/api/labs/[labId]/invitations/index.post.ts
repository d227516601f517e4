import { invitationCreate } from '#shared/schemas/invitations'
import { labParams } from '#shared/schemas/labs'
import { inviteToLab } from '../../../../services/invitations'
import { requireLabPermission } from '../../../../utils/access'
import { appOrigin } from '../../../../utils/origin'
import { validBody, validParams } from '../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'members:manage')
  const body = await validBody(event, invitationCreate)
  const invitation = await inviteToLab(caller, body, appOrigin(event))
  setResponseStatus(event, 201)
  return invitation
})
