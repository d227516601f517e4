// The public forecast API (docs/forecast-api.md): a junction, a network or a chip document.
import { ForecastInputError, runForecast } from '../../../shared/physics/forecast'
import { requireSession } from '../../utils/access'

export default defineEventHandler(async (event) => {
  requireSession(event)
  const request = await readBody(event).catch(() => {
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: 'Body must be valid JSON' })
  })
  try {
    return runForecast(request)
  } catch (error) {
    if (!(error instanceof ForecastInputError)) throw error
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: error.message, data: { issues: error.issues } })
  }
})
