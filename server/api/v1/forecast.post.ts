// The public forecast API (docs/forecast-api.md): a junction, a network or a chip document, computed in a
// geometry worker with a time budget (server/utils/summaryWorker.ts); a bad request is a 400 naming each field.
import { requireSession } from '../../utils/access'
import { forecastOffThread } from '../../utils/summaryWorker'

export default defineEventHandler(async (event) => {
  requireSession(event)
  const request = await readBody(event).catch(() => {
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: 'Body must be valid JSON' })
  })
  return forecastOffThread(request)
})
