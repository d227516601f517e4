// Resolves the caller once per request: a personal API token (`Authorization: Bearer dwt_…`, on /api/v1 and the lab
// routes only: a token cannot manage the account or other tokens), else the session cookie. Every API route except
// sign-in, the liveness probe, the reset request and the invitation and reset link routes (whose token is the
// credential) answers 401 without a caller.
import { createError, defineEventHandler, getRequestURL } from 'h3'
import { resolveToken } from '../services/apiTokens'
import { resolveSession } from '../services/sessions'
import { bearerToken } from '../utils/bearer'
import { readSessionCookie } from '../utils/cookies'

const PUBLIC_API = new Set(['/api/auth/login', '/api/health', '/api/v1/openapi.json'])
// Exactly these two, with this method and a token of the right shape; nothing else under /api/invitations.
const PUBLIC_INVITATION: Array<[method: string, pattern: RegExp]> = [
  ['GET', /^\/api\/invitations\/[A-Za-z0-9_-]{43}$/],
  ['POST', /^\/api\/invitations\/[A-Za-z0-9_-]{43}\/accept$/],
]
// The reset request (answered the same for any address), and the reset link's two routes; nothing else under
// /api/auth/password-reset.
const PUBLIC_PASSWORD_RESET: Array<[method: string, pattern: RegExp]> = [
  ['POST', /^\/api\/auth\/password-reset$/],
  ['GET', /^\/api\/auth\/password-reset\/[A-Za-z0-9_-]{43}$/],
  ['POST', /^\/api\/auth\/password-reset\/[A-Za-z0-9_-]{43}$/],
]
const isPublic = (method: string, path: string) =>
  PUBLIC_API.has(path) ||
  [...PUBLIC_INVITATION, ...PUBLIC_PASSWORD_RESET].some(([m, p]) => m === method && p.test(path))

/** Where a token works: the public API and the lab routes. */
const TOKEN_API = /^\/api\/(v1|labs)(\/|$)/

export default defineEventHandler(async event => {
  const path = getRequestURL(event).pathname
  const bearer = bearerToken(event)
  if (bearer !== null && path.startsWith('/api/')) {
    if (!TOKEN_API.test(path)) {
      throw createError({
        statusCode: 401,
        statusMessage: 'Unauthorized',
        message: 'API tokens work on /api/v1 and /api/labs routes only: sign in for this one',
      })
    }
    event.context.session = await resolveToken(bearer)
    event.context.viaToken = true
    if (!event.context.session) {
      throw createError({
        statusCode: 401,
        statusMessage: 'Unauthorized',
        message:
          'This API token does not work: it was revoked, its lab or role changed, or it was never made. Create a new one on your account page.',
      })
    }
    return
  }
  const token = readSessionCookie(event)
  event.context.session = token ? await resolveSession(token) : null
  if (path.startsWith('/api/') && !isPublic(event.method, path) && !event.context.session) {
    throw createError({ statusCode: 401, statusMessage: 'Unauthorized', message: 'Sign in first' })
  }
})
