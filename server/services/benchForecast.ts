// The forecast a bench run is compared with: the revision's chip at the run's operating point, run in the geometry
// workers, reduced to what the comparison and the calibration need.
import type { DocumentForecast } from '../../shared/physics/forecast'
import type { BenchConditions } from '../../shared/schemas/bench'
import { forecastOffThread } from '../utils/summaryWorker'

export interface RunPrediction {
  junctionId: string
  kind: string
  diameterUm: number
  regime: string
  method: string
  valid: boolean
  /** Qd/Qc at the bench when both flows were typed, else the forecast's. */
  flowRatio: number
  forecastFlowRatio: number
  mainWidthUm: number
  depthUm: number
  /** Relative uncertainty the band on the plot shows (± fraction). */
  uncertainty: number
  uncertaintySource: string
}

/** ±20 %: the spread usually seen between scaling-law forecasts and measured drops (common practice, no source). */
export const DEFAULT_UNCERTAINTY = 0.2

const toUlPerMin = (f: { value: number, unit: string }) => f.unit === 'uL/min' ? f.value : f.unit === 'uL/h' ? f.value / 60 : f.value / 1000

export async function predictRun(document: unknown, operatingPointId: string | undefined, junctionId: string | undefined, conditions: BenchConditions, asBuilt?: { mainWidthUm?: number, depthUm?: number }): Promise<RunPrediction | null> {
  let answer: DocumentForecast
  try {
    answer = await forecastOffThread(operatingPointId ? { document, operatingPoint: operatingPointId } : { document }) as DocumentForecast
  } catch {
    return null
  }
  const junction = answer.junctions.find(j => (junctionId ? j.id === junctionId : j.forecast !== null))
  const f = junction?.forecast
  if (!junction || !f) return null
  const typedRatio = conditions.continuousFlow && conditions.dispersedFlow ? toUlPerMin(conditions.dispersedFlow) / toUlPerMin(conditions.continuousFlow) : null
  return {
    junctionId: junction.id,
    kind: junction.kind,
    diameterUm: f.dropletDiameter.value * 1e6,
    regime: f.regime.value,
    method: f.dropletDiameter.method,
    valid: f.dropletDiameter.valid && f.regime.valid,
    flowRatio: typedRatio ?? f.flowRateRatio.value,
    forecastFlowRatio: f.flowRateRatio.value,
    mainWidthUm: asBuilt?.mainWidthUm ?? f.inputs.junction.mainWidth.value * 1e6,
    depthUm: asBuilt?.depthUm ?? f.inputs.junction.depth.value * 1e6,
    uncertainty: DEFAULT_UNCERTAINTY,
    uncertaintySource: 'common practice, no source: scaling-law forecasts of droplet size are usually within ±20 %',
  }
}
