// Resolves the session cookie once per request. Every API route except sign-in (and the liveness probe)
// answers 401 without a live session.
import { createError, defineEventHandler, getRequestURL } from 'h3'
import { resolveSession } from '../services/sessions'
import { readSessionCookie } from '../utils/cookies'

const PUBLIC_API = new Set(['/api/auth/login', '/api/health'])

export default defineEventHandler(async (event) => {
  const path = getRequestURL(event).pathname
  const token = readSessionCookie(event)
  event.context.session = token ? await resolveSession(token) : null
  if (path.startsWith('/api/') && !PUBLIC_API.has(path) && !event.context.session) {
    throw createError({ statusCode: 401, statusMessage: 'Unauthorized', message: 'Sign in first' })
  }
})
