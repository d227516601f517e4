// The public planner API (docs/planner.md): a target droplet → operating window, recommended point, geometry per
// junction kind, loading and run plan; computed in a geometry worker with a time budget; a bad request is a 400
// naming each field.
import { requireSession } from '../../utils/access'
import { planOffThread } from '../../utils/summaryWorker'

export default defineEventHandler(async (event) => {
  requireSession(event)
  const request = await readBody(event).catch(() => {
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: 'Body must be valid JSON' })
  })
  return planOffThread(request)
})
