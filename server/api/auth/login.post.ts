import { signInBody } from '../../../shared/schemas/auth'
import { createSession } from '../../services/sessions'
import { checkCredentials } from '../../services/signIn'
import { setMarkerCookie, setSessionCookie } from '../../utils/cookies'
import { validBody } from '../../utils/validate'

export default defineEventHandler(async (event) => {
  const body = await validBody(event, signInBody)
  const userId = await checkCredentials(body, getRequestIP(event, { xForwardedFor: true }) ?? 'unknown')
  const { token, expiresAt } = await createSession(userId)
  setSessionCookie(event, token, expiresAt)
  setMarkerCookie(event, expiresAt)
  // `marker` is what the auth module stores client-side: it is not a credential.
  return { marker: 'signed-in' }
})
