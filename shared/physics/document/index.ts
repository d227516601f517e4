// The chip-document forecast: parse → operating point → network → every junction. See shared/physics/README.md.
import { forecastDocument } from './forecast'
import { parseDocumentRequest } from './request'
import type { DocumentForecast } from './types'
import type { LiquidLibrary } from '../liquids'

export { forecastDocument } from './forecast'
export { summarizeForecast, type ForecastSummary } from './summary'
export { compileDocument } from './compile'
export { COINCIDENCE_UM } from './connect'
export { SINGLE_PHASE } from './network'
export { TWO_PHASE, COUPLING_TOLERANCE } from './twophase'
export { documentForecastRequest } from './request'
export type {
  CompiledDocument,
  DocumentChannel,
  DocumentForecast,
  DocumentForecastOptions,
  DocumentJunction,
  DocumentJunctionKind,
  DocumentNetwork,
  DocumentWarning,
  OperatingWindow,
} from './types'

/** `{ "document": <chip document>, "operatingPoint"?: id, "limits"?, "resistanceMethod"? }` → DocumentForecast. */
export function runDocumentForecast(request: unknown, library?: LiquidLibrary): DocumentForecast {
  const { document, operatingPoint, options } = parseDocumentRequest(request)
  return forecastDocument(document, operatingPoint, library ? { ...options, library } : options)
}
