// Public (the token is the credential): join the lab, creating the account and signing in when there is none.
import { invitationAccept, invitationTokenParams } from '#shared/schemas/invitations'
import type { InvitationAccepted } from '#shared/types/invitations'
import { acceptInvitation } from '../../../services/invitations'
import { createSession } from '../../../services/sessions'
import { setMarkerCookie, setSessionCookie } from '../../../utils/cookies'
import { validBody, validParams } from '../../../utils/validate'

export default defineEventHandler(async (event): Promise<InvitationAccepted> => {
  const { token } = validParams(event, invitationTokenParams)
  const body = await validBody(event, invitationAccept)
  const accepted = await acceptInvitation(event.context.session ?? null, token, body)
  if (accepted.newAccount) {
    const { token: sessionToken, expiresAt } = await createSession(accepted.userId)
    setSessionCookie(event, sessionToken, expiresAt)
    setMarkerCookie(event, expiresAt)
  }
  return { labId: accepted.labId, role: accepted.role, newAccount: accepted.newAccount }
})
