import { endSession } from '../../services/sessions'
import { clearSessionCookies, readSessionCookie } from '../../utils/cookies'

export default defineEventHandler(async event => {
  const token = readSessionCookie(event)
  if (token) await endSession(token)
  clearSessionCookies(event)
  return { ok: true }
})
