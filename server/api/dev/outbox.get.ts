// Whether this server keeps a development outbox (the local fake SMTP). The UI shows its menu entry when it does;
// the outbox itself (/api/labs/:labId/outbox) answers 404 when it does not.
import { outboxAvailable } from '../../services/outbox'
import { requireSession } from '../../utils/access'

export default defineEventHandler(event => {
  requireSession(event)
  return { available: outboxAvailable() }
})
