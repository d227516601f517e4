// The short form stored with each revision: per junction its regime, size and rate; per inlet its pressure and flow.
import type { DocumentForecast } from './types'

export interface ForecastSummary {
  operatingPoint: string
  junctions: {
    id: string
    kind: string
    regime: string | null
    dropletDiameterUm: number | null
    frequencyHz: number | null
    valid: boolean
  }[]
  inlets: { port: string; mode: 'pressure' | 'flow'; pressureMbar: number; flowUlPerMin: number }[]
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
      port: inlet.port,
      mode: inlet.mode,
      pressureMbar: figures(inlet.pressure.value / 100),
      flowUlPerMin: figures(inlet.flow.value * UL_PER_MIN_PER_M3_PER_S),
    })),
  }
}
