// The short form stored with each revision: per junction its regime, size and rate; per inlet its pressure and flow.
// One type from the core to the database and back: the editor's live labels, the stored revision summary
// (shared/types/designs.ts) and the pages read these same fields under these same names.
import type { DocumentForecast } from './types'

export interface JunctionSummary {
  id: string
  kind: string
  regime: string | null
  dropletDiameterUm: number | null
  frequencyHz: number | null
  valid: boolean
}
/** `portId` as in the document's operating points (shared/schemas/chip/operating-points.ts). */
export interface InletSummary {
  portId: string
  mode: 'pressure' | 'flow'
  pressureMbar: number
  flowUlPerMin: number
}
export interface ForecastSummary {
  operatingPoint: string
  junctions: JunctionSummary[]
  inlets: InletSummary[]
}

/** Four significant figures: a forecast is an estimate, and stored summaries compare without rounding noise. */
const figures = (value: number): number => Number(value.toPrecision(4))
/** 1 m³/s = 1e9 µL/s = 6e10 µL/min. */
const UL_PER_MIN_PER_M3_PER_S = 6e10

export function summarizeForecast(answer: DocumentForecast): ForecastSummary {
  return {
    operatingPoint: answer.operatingPoint.id,
    junctions: answer.junctions.map(({ id, kind, forecast }) => ({
      id,
      kind,
      regime: forecast ? forecast.regime.value : null,
      dropletDiameterUm: forecast ? figures(forecast.dropletDiameter.value * 1e6) : null,
      frequencyHz: forecast ? figures(forecast.frequency.value) : null,
      valid: forecast !== null && forecast.regime.valid && forecast.dropletDiameter.valid && forecast.frequency.valid,
    })),
    inlets: answer.network.inlets.map(inlet => ({
      portId: inlet.port,
      mode: inlet.mode,
      pressureMbar: figures(inlet.pressure.value / 100),
      flowUlPerMin: figures(inlet.flow.value * UL_PER_MIN_PER_M3_PER_S),
    })),
  }
}
