// Signed in: change the password (current + new). Every other session of the person ends; this one stays.
import { passwordChangeBody } from '#shared/schemas/auth'
import type { PasswordChanged } from '#shared/types/account'
import { changePassword } from '../../services/passwords'
import { requireSession } from '../../utils/access'
import { clientAddress } from '../../utils/clientAddress'
import { readSessionCookie } from '../../utils/cookies'
import { serverPasswordChecks } from '../../utils/password'
import { readDeviceCookie, withRetryAfter } from '../../utils/signedIn'
import { validBody } from '../../utils/validate'

export default defineEventHandler(async (event): Promise<PasswordChanged> => {
  const session = requireSession(event)
  const body = await validBody(event, passwordChangeBody(session.user, serverPasswordChecks))
  return changePassword(session, readSessionCookie(event)!, body, {
    ip: clientAddress(event),
    deviceToken: readDeviceCookie(event),
  }).catch(withRetryAfter(event))
})
