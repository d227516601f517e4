// Public (the token is the credential): set the new password. Every session of the person ends, and this browser
// is signed in afresh.
import { passwordResetBody, passwordResetParams } from '#shared/schemas/auth'
import type { PasswordResetDone } from '#shared/types/account'
import { knownDevice } from '../../../services/knownDevices'
import { resetPassword } from '../../../services/passwords'
import { readDeviceCookie, startSignedIn } from '../../../utils/signedIn'
import { validBody, validParams } from '../../../utils/validate'

export default defineEventHandler(async (event): Promise<PasswordResetDone> => {
  const { token } = validParams(event, passwordResetParams)
  // The shape and the account-free rules here; the service checks again against the account's e-mail and name.
  const body = await validBody(event, passwordResetBody())
  const { userId, sessionsEnded } = await resetPassword(token, body)
  await startSignedIn(event, userId, await knownDevice(readDeviceCookie(event), userId))
  return { sessionsEnded }
})
