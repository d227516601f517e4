// The public forecast API (docs/forecast-api.md): a junction, a network or a chip document, computed in a
// geometry worker with a time budget (server/utils/summaryWorker.ts); a bad request is a 400 naming each field.
// With `?lab=<id>` the lab's own liquids and pairs are looked up too (docs/libraries.md).
import { forecastQuery } from '#shared/schemas/libraries'
import { labLibraryData } from '../../services/libraries'
import { requireLabPermission, requireSession } from '../../utils/access'
import { useDb } from '../../utils/db'
import { forecastOffThread } from '../../utils/summaryWorker'
import { validQuery } from '../../utils/validate'

export default defineEventHandler(async event => {
  requireSession(event)
  const { lab } = validQuery(event, forecastQuery)
  if (lab) requireLabPermission(event, lab, 'forecast:run')
  const request = await readBody(event).catch(() => {
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: 'Body must be valid JSON' })
  })
  const library = lab ? await labLibraryData(useDb(), lab) : null
  return forecastOffThread(request, library && { liquids: library.liquids, pairs: library.pairs })
})
