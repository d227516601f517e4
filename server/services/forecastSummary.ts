// The forecast part of a revision summary. A document the forecast cannot solve still saves: the reason is kept.
import { ForecastInputError } from '#shared/physics/errors'
import { forecastDocument, summarizeForecast } from '#shared/physics/document'
import type { ChipDocument } from '#shared/schemas/chip'
import type { RevisionSummary } from '#shared/types/designs'

type ForecastPart = Pick<RevisionSummary, 'operatingPoint' | 'junctions' | 'inlets' | 'forecastError'>

export function forecastSummary(doc: ChipDocument): ForecastPart {
  try {
    const s = summarizeForecast(forecastDocument(doc))
    return { operatingPoint: s.operatingPoint, junctions: s.junctions, inlets: s.inlets.map(i => ({ portId: i.port, pressureMbar: i.pressureMbar, flowUlPerMin: i.flowUlPerMin })), forecastError: null }
  } catch (error) {
    if (!(error instanceof ForecastInputError) && !(error instanceof Error && error.name === 'NetworkError')) console.error('[summary] forecast failed:', error)
    const message = error instanceof ForecastInputError ? error.issues.map(i => i.message).join('; ') : error instanceof Error ? error.message : String(error)
    return { operatingPoint: doc.activeOperatingPoint ?? null, junctions: [], inlets: [], forecastError: `No forecast for this revision: ${message}` }
  }
}
