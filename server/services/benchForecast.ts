// The forecast a bench run is compared with: the revision's chip at the run's operating point, run in the geometry
// workers, reduced to what the comparison and the calibration need.
import type { DocumentForecast } from '#shared/physics/forecast'
import type { BenchConditions } from '#shared/schemas/bench'
import { garsteckiLength, GARSTECKI_SQUEEZING, vanSteijnVolume, VAN_STEIJN_SQUEEZING } from '#shared/physics/junction/tJunction'
import { plugVolume } from '#shared/physics/junction/plugVolume'
import type { Metres } from '#shared/physics/units'
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
  /** False when flows were typed but the forecast could only be had at the design's operating point. */
  atBenchFlows: boolean
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
  const w = f.inputs.junction.mainWidth.value as Metres
  const win = f.inputs.junction.inletWidth.value as Metres
  const h = f.inputs.junction.depth.value as Metres
  // A T-junction's squeezing size at the flow ratio really set at the bench (the forecast's own law); other kinds
  // keep the forecast at the design's operating point, and say so.
  let diameter = f.dropletDiameter.value
  let atBenchFlows = typedRatio === null
  if (typedRatio !== null && junction.kind === 't-junction') {
    const method = f.dropletDiameter.method
    const volume = method.startsWith(VAN_STEIJN_SQUEEZING.id) ? vanSteijnVolume(w, win, h, typedRatio)
      : method.startsWith(GARSTECKI_SQUEEZING.id) ? plugVolume(garsteckiLength(w, f.inputs.model.alpha ?? 1, typedRatio), w, h) : null
    if (volume !== null) { diameter = Math.cbrt((6 * volume) / Math.PI); atBenchFlows = true }
  }
  return {
    junctionId: junction.id,
    kind: junction.kind,
    diameterUm: diameter * 1e6,
    atBenchFlows,
    regime: f.regime.value,
    method: f.dropletDiameter.method,
    valid: f.dropletDiameter.valid && f.regime.valid,
    flowRatio: typedRatio ?? f.flowRateRatio.value,
    forecastFlowRatio: f.flowRateRatio.value,
    mainWidthUm: asBuilt?.mainWidthUm ?? w * 1e6,
    depthUm: asBuilt?.depthUm ?? h * 1e6,
    uncertainty: DEFAULT_UNCERTAINTY,
    uncertaintySource: 'common practice, no source: scaling-law forecasts of droplet size are usually within ±20 %',
  }
}
