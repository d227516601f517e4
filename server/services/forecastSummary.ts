// The forecast part of a revision summary. A document the forecast cannot solve still saves: the reason is kept.
import type { ChipDocument } from '../../shared/schemas/chip'
import type { RevisionSummary } from '../../shared/types/designs'

type ForecastPart = Pick<RevisionSummary, 'operatingPoint' | 'junctions' | 'inlets' | 'forecastError'>

export function forecastSummary(doc: ChipDocument): ForecastPart {
  return { operatingPoint: doc.activeOperatingPoint ?? null, junctions: [], inlets: [], forecastError: 'The chip forecast is not available yet' }
}
