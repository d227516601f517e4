// Whether the development outbox exists on this server (404 when it does not). The UI shows its menu entry on 200.
import { requireOutbox } from '../../services/outbox'
import { requireSession } from '../../utils/access'

export default defineEventHandler((event) => {
  requireSession(event)
  requireOutbox()
  return { available: true }
})
