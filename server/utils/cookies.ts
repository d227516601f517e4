import type { H3Event } from 'h3'
import { deleteCookie, getCookie, getRequestProtocol, setCookie } from 'h3'

// The credential: an httpOnly, SameSite=Lax cookie that page scripts cannot read.
export const SESSION_COOKIE = 'dw_session'

export function setSessionCookie(event: H3Event, token: string, expires: Date) {
  setCookie(event, SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    path: '/',
    expires,
    secure: getRequestProtocol(event, { xForwardedProto: true }) === 'https',
  })
}

// A readable marker for the auth module's client state; it is not a credential (the server never trusts it).
export const MARKER_COOKIE = 'dw.marker'

export function setMarkerCookie(event: H3Event, expires: Date) {
  setCookie(event, MARKER_COOKIE, 'signed-in', { httpOnly: false, sameSite: 'lax', path: '/', expires })
}

export const readSessionCookie = (event: H3Event) => getCookie(event, SESSION_COOKIE)
export function clearSessionCookies(event: H3Event) {
  deleteCookie(event, SESSION_COOKIE, { path: '/' })
  deleteCookie(event, MARKER_COOKIE, { path: '/' })
}
