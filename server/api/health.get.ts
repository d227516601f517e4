import { RETRY_AFTER_S } from '../utils/dbErrors'
import { databaseHealth } from '../utils/health'
import { summaryWorkerRunning } from '../utils/summaryWorker'

// Liveness and readiness: 200 when the database answers, 503 with Retry-After while it does not.
export default defineEventHandler(async event => {
  const database = await databaseHealth()
  if (database !== 'ok') {
    setResponseStatus(event, 503, 'Service Unavailable')
    setResponseHeader(event, 'Retry-After', RETRY_AFTER_S)
  }
  return { ok: database === 'ok', database, summaryWorker: summaryWorkerRunning() }
})
