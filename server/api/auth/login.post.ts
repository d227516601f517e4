import { signInBody } from '#shared/schemas/auth'
import { checkCredentials } from '../../services/signIn'
import { clientAddress } from '../../utils/clientAddress'
import { readDeviceCookie, startSignedIn, withRetryAfter } from '../../utils/signedIn'
import { validBody } from '../../utils/validate'

export default defineEventHandler(async event => {
  const body = await validBody(event, signInBody)
  const { userId, deviceId } = await checkCredentials({
    ...body,
    ip: clientAddress(event),
    deviceToken: readDeviceCookie(event),
  }).catch(withRetryAfter(event))
  await startSignedIn(event, userId, deviceId)
  // `marker` is what the auth module stores client-side: it is not a credential.
  return { marker: 'signed-in' }
})
