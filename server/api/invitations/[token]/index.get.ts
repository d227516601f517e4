// Public (the token is the credential): what the invitation link offers.
import { invitationTokenParams } from '#shared/schemas/invitations'
import { describeInvitation } from '../../../services/invitations'
import { validParams } from '../../../utils/validate'

export default defineEventHandler(async event => {
  const { token } = validParams(event, invitationTokenParams)
  return describeInvitation(token)
})
