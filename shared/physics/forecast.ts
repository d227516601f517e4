// The public entry point of the forecast: one function for a junction, a network or a chip document.
import { ForecastInputError } from './errors'
import { runJunctionForecast } from './forecast/junctionRequest'
import { runNetworkForecast, type NetworkForecast } from './forecast/network'
import type { JunctionForecast } from './forecast/types'
import type { LiquidLibrary } from './liquids'
import { runDocumentForecast, type DocumentForecast } from './document'

export { ForecastInputError } from './errors'
export type { JunctionForecast } from './forecast/types'
export type { NetworkForecast } from './forecast/network'
export type { DocumentForecast } from './document'

export type ForecastAnswer = JunctionForecast | NetworkForecast | DocumentForecast

/**
 * Runs a forecast request (parsed JSON). Returns the answer, or throws ForecastInputError whose `issues`
 * name each bad field ({ path, message }). Any other error is a bug.
 */
export function runForecast(request: unknown, library?: LiquidLibrary): ForecastAnswer {
  if (typeof request !== 'object' || request === null || Array.isArray(request)) {
    throw new ForecastInputError([
      { path: '', message: 'the request must be a JSON object with "junction", "network" or "document"' },
    ])
  }
  const keys = ['junction', 'network', 'document'].filter(key => key in request)
  if (keys.length !== 1) {
    throw new ForecastInputError([
      {
        path: '',
        message: `give exactly one of "junction", "network" or "document" (got ${keys.length ? keys.join(', ') : 'none'})`,
      },
    ])
  }
  if (keys[0] === 'junction') return runJunctionForecast(request, library)
  if (keys[0] === 'network') return runNetworkForecast(request, library)
  return runDocumentForecast(request, library)
}
