// A lab's calibration from its bench runs, per junction kind, and the calibrated forecast it gives.
//   T-junction: α of L/w = 1 + α Qd/Qc (Garstecki et al. 2006, Lab Chip 6, 437, eq. 1). The model's intercept is 1
//     (a plug is at least one channel width long), so L/w − 1 is fitted through the origin: the intercept is the
//     model's, not a free parameter and not forced to zero on L/w. Diameters become lengths through the
//     confined-plug volume (Musterd et al. 2015, RSC Adv. 5, 16042).
//   Step emulsification: the ratio d/h of d ≈ k h (Dangla, Kayi & Baroud 2013, PNAS 110, 853 report k ≈ 4 below
//     a critical capillary number — from memory), fitted through the origin on h.
//   Other kinds: a multiplicative correction measured ≈ k × predicted.
import type { Metres } from '../units'
import { plugLength, plugVolume, sphereVolume } from '../junction/plugVolume'
import { fitCorrectionFactor, fitSqueezingAlpha, fitThroughOrigin, type Fit } from './fit'

export interface CalibrationRun {
  id: string
  kind: string
  ranAt: string
  /** Mean measured size, µm (a diameter, or a plug length with quantity "plug-length"). */
  measuredUm: number
  quantity: 'diameter' | 'plug-length'
  predictedDiameterUm: number | null
  flowRatio: number | null
  mainWidthUm: number | null
  depthUm: number | null
  /** The forecast's regime at the run: α is a squeezing coefficient, so other T-junction regimes are fitted apart. */
  regime?: string | null
}

export type CalibrationModel = 'squeezing-alpha' | 'step-ratio' | 'correction-factor'

export interface LabCalibration {
  /** The group: the junction kind, or `t-junction/<regime>` for T-junction runs outside squeezing. */
  kind: string
  junctionKind: string
  model: CalibrationModel
  parameter: string
  fit: Fit
  runs: number
  latestRunAt: string
  /** Per run: x, measured y, fitted y and the residual (y − fitted), in the fit's own variables. */
  residuals: { runId: string; x: number; y: number; fitted: number; residual: number }[]
}

const MODEL: Record<string, { model: CalibrationModel; parameter: string }> = {
  't-junction': { model: 'squeezing-alpha', parameter: 'α (L/w = 1 + α Qd/Qc)' },
  'step-nozzle': { model: 'step-ratio', parameter: 'd/h' },
  'step-array': { model: 'step-ratio', parameter: 'd/h' },
}

/**
 * Which calibration a run (or a forecast) belongs to. Garstecki's α holds in squeezing (and is the usual
 * extrapolation through the transition band); a T-junction in dripping or jetting gets its own multiplicative
 * correction instead of bending α.
 */
export function calibrationKey(kind: string, regime?: string | null): string {
  return kind === 't-junction' && regime && regime !== 'squeezing' && regime !== 'transition'
    ? `t-junction/${regime}`
    : kind
}

const um = (v: number) => (v * 1e-6) as Metres

/** Sphere-equivalent diameter of a plug of length L in a w × h channel, µm. */
export function plugDiameterUm(lengthUm: number, widthUm: number, depthUm: number): number {
  const volume = plugVolume(um(lengthUm), um(widthUm), um(depthUm))
  return Math.cbrt((6 * volume) / Math.PI) * 1e6
}

function points(kind: string, runs: CalibrationRun[]): { x: number[]; y: number[]; used: CalibrationRun[] } {
  const x: number[] = []
  const y: number[] = []
  const used: CalibrationRun[] = []
  const model = MODEL[kind]?.model ?? 'correction-factor'
  for (const run of runs) {
    if (model === 'squeezing-alpha') {
      if (!(run.flowRatio! > 0 && run.mainWidthUm! > 0 && run.depthUm! > 0)) continue
      const length =
        run.quantity === 'plug-length'
          ? run.measuredUm
          : plugLength(sphereVolume(um(run.measuredUm)), um(run.mainWidthUm!), um(run.depthUm!)) * 1e6
      x.push(run.flowRatio!)
      y.push(length / run.mainWidthUm! - 1)
    } else if (model === 'step-ratio') {
      if (!(run.depthUm! > 0) || run.quantity !== 'diameter') continue
      x.push(run.depthUm!)
      y.push(run.measuredUm)
    } else {
      if (!(run.predictedDiameterUm! > 0) || run.quantity !== 'diameter') continue
      x.push(run.predictedDiameterUm!)
      y.push(run.measuredUm)
    }
    used.push(run)
  }
  return { x, y, used }
}

/** One calibration per junction kind with at least two usable runs; kinds with fewer are left out. */
export function fitLabCalibrations(runs: readonly CalibrationRun[]): LabCalibration[] {
  const keys = [...new Set(runs.map(r => calibrationKey(r.kind, r.regime)))].sort()
  const out: LabCalibration[] = []
  for (const kind of keys) {
    const { x, y, used } = points(
      kind,
      runs.filter(r => calibrationKey(r.kind, r.regime) === kind),
    )
    if (used.length < 2 || !x.some(v => v !== 0)) continue
    const { model, parameter } = MODEL[kind] ?? {
      model: 'correction-factor' as const,
      parameter: 'k (measured = k × predicted)',
    }
    const fit = model === 'correction-factor' ? fitCorrectionFactor(x, y) : fitThroughOrigin(x, y)
    out.push({
      kind,
      junctionKind: used[0]!.kind,
      model,
      parameter,
      fit,
      runs: used.length,
      latestRunAt: used
        .map(r => r.ranAt)
        .sort()
        .at(-1)!,
      residuals: used.map((r, i) => ({
        runId: r.id,
        x: x[i]!,
        y: y[i]!,
        fitted: fit.value * x[i]!,
        residual: y[i]! - fit.value * x[i]!,
      })),
    })
  }
  return out
}

/** The calibrated diameter (µm) of a forecast junction, with the range its 95 % interval gives. */
export function calibratedDiameterUm(
  calibration: LabCalibration,
  junction: {
    predictedDiameterUm: number | null
    flowRatio: number | null
    mainWidthUm: number | null
    depthUm: number | null
  },
): { value: number; interval95: [number, number] } | null {
  const at = (k: number): number | null => {
    if (calibration.model === 'squeezing-alpha') {
      if (!(junction.flowRatio! > 0 && junction.mainWidthUm! > 0 && junction.depthUm! > 0)) return null
      return plugDiameterUm(
        junction.mainWidthUm! * (1 + k * junction.flowRatio!),
        junction.mainWidthUm!,
        junction.depthUm!,
      )
    }
    if (calibration.model === 'step-ratio') return junction.depthUm! > 0 ? k * junction.depthUm! : null
    return junction.predictedDiameterUm! > 0 ? k * junction.predictedDiameterUm! : null
  }
  const value = at(calibration.fit.value)
  const low = at(calibration.fit.interval95[0])
  const high = at(calibration.fit.interval95[1])
  if (value === null || low === null || high === null) return null
  return { value, interval95: [Math.min(low, high), Math.max(low, high)] }
}

export { fitSqueezingAlpha }
