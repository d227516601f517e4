// What a successful sign-in (password, or a reset link) leaves in the browser: the session cookie, the auth
// module's marker and the known-device cookie.
import type { H3Event } from 'h3'
import { getCookie, getRequestProtocol, setCookie, setResponseHeader } from 'h3'
import { rememberDevice } from '../services/knownDevices'
import { createSession } from '../services/sessions'
import { setMarkerCookie, setSessionCookie } from './cookies'

// The known-device cookie (server/services/knownDevices.ts): httpOnly, sent only to the sign-in routes. It is not a
// credential: it only decides which sign-in limit an attempt counts against.
export const DEVICE_COOKIE = 'dw_device'

export const readDeviceCookie = (event: H3Event) => getCookie(event, DEVICE_COOKIE)

/** A new session for `userId` in this browser, which becomes (or stays) a known device of the account. */
export async function startSignedIn(event: H3Event, userId: string, deviceId: string | null): Promise<void> {
  const { token, expiresAt } = await createSession(userId)
  setSessionCookie(event, token, expiresAt)
  setMarkerCookie(event, expiresAt)
  const device = await rememberDevice(userId, deviceId)
  if (device.token) {
    setCookie(event, DEVICE_COOKIE, device.token, {
      httpOnly: true,
      sameSite: 'lax',
      path: '/api/auth',
      expires: device.expiresAt,
      secure: getRequestProtocol(event, { xForwardedProto: true }) === 'https',
    })
  }
}

/** A 429 from the sign-in limits carries its wait; this puts it in Retry-After as well. */
export function withRetryAfter(event: H3Event) {
  return (error: unknown): never => {
    const seconds = (error as { data?: { retryAfterSeconds?: number } })?.data?.retryAfterSeconds
    if (seconds) setResponseHeader(event, 'Retry-After', seconds)
    throw error
  }
}
