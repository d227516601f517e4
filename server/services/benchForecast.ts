// The forecast a bench run is compared with: the revision's chip at the run's operating point, run in the geometry
// workers, reduced to what the comparison and the calibration need.
import { createError } from 'h3'
import { ZodError } from 'zod'
import { applyBenchSizes, AsBuiltError } from '#shared/fabrication/asBuilt'
import type { DocumentForecast } from '#shared/physics/forecast'
import type { BenchConditions, BenchRunCreate } from '#shared/schemas/bench'
import { chipDocument, type ChipDocument } from '#shared/schemas/chip'
import { benchPoint, hasBenchSettings } from '#shared/physics/calibration/benchPoint'
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
  /** Qd/Qc of the forecast compared with: at the bench when flows or pressures were typed, else as designed. */
  flowRatio: number
  forecastFlowRatio: number
  /** The junction's main width and depth on the chip the forecast ran on (as built, with the bench's sizes). */
  mainWidthUm: number
  depthUm: number
  chip?: ChipBasis
  /** False when bench settings were typed but the forecast could only be had at the design's operating point. */
  atBenchFlows: boolean
  /** Relative uncertainty the band on the plot shows (± fraction). */
  uncertainty: number
  uncertaintySource: string
}

/** ±20 %: the spread usually seen between scaling-law forecasts and measured drops (common practice, no source). */
export const DEFAULT_UNCERTAINTY = 0.2

const badChip = (issues: Array<{ path: string; message: string }>) =>
  createError({
    statusCode: 400,
    statusMessage: 'Bad Request',
    data: { issues },
    message: `The run's chip is invalid: ${issues
      .slice(0, 5)
      .map(i => i.message)
      .join('; ')}`,
  })

/**
 * The chip a run's forecast is computed on: the latest as-built report when one exists (unless the run asks for the
 * chip as drawn), with the sizes measured at the bench on its junction. Asking for "as-built" without a report, or
 * sizes the chip's own limits refuse, is a 400 naming why.
 */
export async function benchChip(
  labId: string,
  revisionId: string,
  drawn: unknown,
  input: Pick<BenchRunCreate, 'chip' | 'asBuilt' | 'junctionId'>,
): Promise<{ document: unknown; chip: ChipBasis }> {
  const report = input.chip === 'as-drawn' ? null : await latestAsBuiltChip(labId, revisionId)
  if (input.chip === 'as-built' && !report)
    throw badChip([
      {
        path: 'chip',
        message:
          'No as-built report has been recorded for this revision: forecast on the chip as drawn, or record the as-built first',
      },
    ])
  const sizes = input.asBuilt ?? {}
  const benchSizes = Object.values(sizes).some(v => v !== undefined)
  let document = report?.document ?? drawn
  if (benchSizes) {
    try {
      document = chipDocument.parse(applyBenchSizes(document as ChipDocument, input.junctionId, sizes))
    } catch (error) {
      if (error instanceof AsBuiltError) throw badChip([{ path: error.field, message: error.message }])
      if (error instanceof ZodError)
        throw badChip(
          error.issues.map(i => ({
            path: `asBuilt.${i.path.join('.')}`,
            message: `With the sizes measured at the bench, ${i.message}`,
          })),
        )
      throw error
    }
  }
  return {
    document,
    chip: {
      basis: report ? 'as-built' : 'as-drawn',
      asBuiltId: report?.id ?? null,
      reportedAt: report?.createdAt.toISOString() ?? null,
      benchSizes,
    },
  }
}

async function forecastAt(document: unknown, operatingPointId: string | undefined): Promise<DocumentForecast | null> {
  try {
    return (await forecastOffThread(
      operatingPointId ? { document, operatingPoint: operatingPointId } : { document },
    )) as DocumentForecast
  } catch {
    return null
  }
}

/**
 * The forecast a run is compared with: the chip at the design's operating point, then, when the run typed flows,
 * pressures or a temperature, at the operating point as set at the bench (`benchPoint`), for every junction kind.
 * When the bench point gives no forecast for the junction (below its entry barrier, say), the design's point is
 * kept and `atBenchFlows` says so.
 */
export async function predictRun(
  document: unknown,
  operatingPointId: string | undefined,
  junctionId: string | undefined,
  conditions: BenchConditions,
): Promise<RunPrediction | null> {
  const designed = await forecastAt(document, operatingPointId)
  const pick = (answer: DocumentForecast | null) =>
    answer?.junctions.find(j => (junctionId ? j.id === junctionId : j.forecast !== null))
  const designJunction = pick(designed)
  if (!designJunction?.forecast) return null
  let junction = designJunction
  let atBenchFlows = !hasBenchSettings(conditions)
  if (!atBenchFlows) {
    const phases = new Map(designed!.network.inlets.map(i => [i.port, i.phase] as const))
    const bench = benchPoint(document as ChipDocument, operatingPointId, conditions, phases)
    const atBench = bench ? pick(await forecastAt(bench.document, bench.operatingPointId)) : undefined
    if (atBench?.forecast && atBench.id === designJunction.id) {
      junction = atBench
      atBenchFlows = true
    }
  }
  const f = junction.forecast!
  return {
    junctionId: junction.id,
    kind: junction.kind,
    diameterUm: f.dropletDiameter.value * 1e6,
    atBenchFlows,
    regime: f.regime.value,
    method: f.dropletDiameter.method,
    valid: f.dropletDiameter.valid && f.regime.valid,
    flowRatio: f.flowRateRatio.value,
    forecastFlowRatio: designJunction.forecast.flowRateRatio.value,
    mainWidthUm: f.inputs.junction.mainWidth.value * 1e6,
    depthUm: f.inputs.junction.depth.value * 1e6,
    uncertainty: DEFAULT_UNCERTAINTY,
    uncertaintySource: 'common practice, no source: scaling-law forecasts of droplet size are usually within ±20 %',
  }
}
