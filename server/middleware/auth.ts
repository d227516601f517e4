// Resolves the session cookie once per request. Every API route except sign-in, the liveness probe, the reset
// request and the invitation and reset link routes (whose token is the credential) answers 401 without a session.
import { createError, defineEventHandler, getRequestURL } from 'h3'
import { resolveSession } from '../services/sessions'
import { readSessionCookie } from '../utils/cookies'

const PUBLIC_API = new Set(['/api/auth/login', '/api/health'])
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
const isPublic = (method: string, path: string) => PUBLIC_API.has(path)
  || [...PUBLIC_INVITATION, ...PUBLIC_PASSWORD_RESET].some(([m, p]) => m === method && p.test(path))

export default defineEventHandler(async (event) => {
  const path = getRequestURL(event).pathname
  const token = readSessionCookie(event)
  event.context.session = token ? await resolveSession(token) : null
  if (path.startsWith('/api/') && !isPublic(event.method, path) && !event.context.session) {
    throw createError({ statusCode: 401, statusMessage: 'Unauthorized', message: 'Sign in first' })
  }
})
