// Placeholder until the chip-document compiler lands (phase 2).
import { ForecastInputError } from '../errors'
export type DocumentForecast = never
export function runDocumentForecast(_request: unknown): DocumentForecast {
  throw new ForecastInputError([{ path: 'document', message: 'document forecasts are not available yet; send a "network" or "junction" request' }])
}
