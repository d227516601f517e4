// The public planner API (docs/planner.md): a target droplet → operating window, recommended point, geometry per
// junction kind, loading and run plan; computed in a geometry worker with a time budget; a bad request is a 400
// naming each field. With `?lab=<id>` (a lab the caller belongs to) the lab's own liquids, pairs and processes too;
// a process id no lab of the caller's names is a 400 that lists only what the caller may use.
import { planQuery } from '#shared/schemas/libraries'
import { labLibraryData } from '../../services/libraries'
import { requireLabPermission, requireSession } from '../../utils/access'
import { useDb } from '../../utils/db'
import { planOffThread } from '../../utils/summaryWorker'
import { validQuery } from '../../utils/validate'

export default defineEventHandler(async event => {
  requireSession(event)
  const { lab } = validQuery(event, planQuery)
  if (lab) requireLabPermission(event, lab, 'forecast:run')
  const request = await readBody(event).catch(() => {
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: 'Body must be valid JSON' })
  })
  return planOffThread(request, lab ? await labLibraryData(useDb(), lab) : null)
})
