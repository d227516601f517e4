// Ends every session of the signed-in person, on every device, this one included.
import type { SignedOutEverywhere } from '#shared/types/account'
import { signOutEverywhere } from '../../services/passwords'
import { requireSession } from '../../utils/access'
import { clearSessionCookies } from '../../utils/cookies'

export default defineEventHandler(async (event): Promise<SignedOutEverywhere> => {
  const session = requireSession(event)
  const ended = await signOutEverywhere(session.user.id)
  clearSessionCookies(event)
  return ended
})
