// The forecast a bench run is compared with: the revision's chip at the run's operating point, run in the geometry
// workers, reduced to what the comparison and the calibration need.
import { createError } from 'h3'
import { ZodError } from 'zod'
import { applyBenchSizes, AsBuiltError } from '#shared/fabrication/asBuilt'
import type { DocumentForecast } from '#shared/physics/forecast'
import type { BenchConditions, BenchRunCreate } from '#shared/schemas/bench'
import { chipDocument, type ChipDocument } from '#shared/schemas/chip'
import { garsteckiLength, GARSTECKI_SQUEEZING, vanSteijnVolume, VAN_STEIJN_SQUEEZING } from '#shared/physics/junction/tJunction'
import { plugVolume } from '#shared/physics/junction/plugVolume'
import type { Metres } from '#shared/physics/units'
import { forecastOffThread } from '../utils/summaryWorker'
import { latestAsBuiltChip } from './asBuilt'

/** Which chip a run's forecast was computed on. */
export interface ChipBasis {
  basis: 'as-built' | 'as-drawn'
  /** The as-built report used, and when it was recorded. */
  asBuiltId: string | null
  reportedAt: string | null
  /** True when sizes measured at the bench replaced the junction's width(s) or depth. */
  benchSizes: boolean
}

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
  /** The junction's main width and depth on the chip the forecast ran on (as built, with the bench's sizes). */
  mainWidthUm: number
  depthUm: number
  chip?: ChipBasis
  /** False when flows were typed but the forecast could only be had at the design's operating point. */
  atBenchFlows: boolean
  /** Relative uncertainty the band on the plot shows (± fraction). */
  uncertainty: number
  uncertaintySource: string
}

/** ±20 %: the spread usually seen between scaling-law forecasts and measured drops (common practice, no source). */
export const DEFAULT_UNCERTAINTY = 0.2

const toUlPerMin = (f: { value: number, unit: string }) => f.unit === 'uL/min' ? f.value : f.unit === 'uL/h' ? f.value / 60 : f.value / 1000

const badChip = (issues: Array<{ path: string, message: string }>) => createError({
  statusCode: 400, statusMessage: 'Bad Request', data: { issues },
  message: `The run's chip is invalid: ${issues.slice(0, 5).map(i => i.message).join('; ')}`,
})

/**
 * The chip a run's forecast is computed on: the latest as-built report when one exists (unless the run asks for the
 * chip as drawn), with the sizes measured at the bench on its junction. Asking for "as-built" without a report, or
 * sizes the chip's own limits refuse, is a 400 naming why.
 */
export async function benchChip(labId: string, revisionId: string, drawn: unknown, input: Pick<BenchRunCreate, 'chip' | 'asBuilt' | 'junctionId'>): Promise<{ document: unknown, chip: ChipBasis }> {
  const report = input.chip === 'as-drawn' ? null : await latestAsBuiltChip(labId, revisionId)
  if (input.chip === 'as-built' && !report) throw badChip([{ path: 'chip', message: 'No as-built report has been recorded for this revision: forecast on the chip as drawn, or record the as-built first' }])
  const sizes = input.asBuilt ?? {}
  const benchSizes = Object.values(sizes).some(v => v !== undefined)
  let document = report?.document ?? drawn
  if (benchSizes) {
    try {
      document = chipDocument.parse(applyBenchSizes(document as ChipDocument, input.junctionId, sizes))
    } catch (error) {
      if (error instanceof AsBuiltError) throw badChip([{ path: error.field, message: error.message }])
      if (error instanceof ZodError) throw badChip(error.issues.map(i => ({ path: `asBuilt.${i.path.join('.')}`, message: `With the sizes measured at the bench, ${i.message}` })))
      throw error
    }
  }
  return { document, chip: { basis: report ? 'as-built' : 'as-drawn', asBuiltId: report?.id ?? null, reportedAt: report?.createdAt.toISOString() ?? null, benchSizes } }
}

export async function predictRun(document: unknown, operatingPointId: string | undefined, junctionId: string | undefined, conditions: BenchConditions): Promise<RunPrediction | null> {
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
    mainWidthUm: w * 1e6,
    depthUm: h * 1e6,
    uncertainty: DEFAULT_UNCERTAINTY,
    uncertaintySource: 'common practice, no source: scaling-law forecasts of droplet size are usually within ±20 %',
  }
}
