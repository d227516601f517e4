// A run at the chosen point: how long it takes and how much of each liquid it uses.
import { quantity, type Method, type Quantity } from '../quantity'
import { UNIT } from '../units'

export const RUN_CONTINUITY: Method = {
  id: 'run-continuity',
  source:
    'continuity at steady generation: t = N / f, V_liquid = Q t, emulsion = (Qc + Qd) t (Garstecki et al. 2006, Lab Chip 6, 437: f = Qd / V)',
}

export interface RunPlan {
  droplets: Quantity
  duration: Quantity
  continuousVolume: Quantity
  dispersedVolume: Quantity
  emulsionVolume: Quantity
  /** Dispersed volume fraction of the emulsion collected. */
  dispersedFraction: Quantity
}

/** A run of `droplets` drops or `minutes` minutes at flows qc, qd (m³/s) and rate f (Hz); valid follows the point's forecast. */
export function runPlan(
  at: { qc: number; qd: number; frequency: number; valid: boolean },
  run: { droplets?: number; minutes?: number },
): RunPlan {
  const seconds = run.minutes !== undefined ? run.minutes * 60 : run.droplets! / at.frequency
  const droplets = run.droplets ?? at.frequency * seconds
  const q = (v: number, unit: string) => quantity(v, unit, RUN_CONTINUITY, at.valid)
  return {
    droplets: q(droplets, UNIT.none),
    duration: q(seconds, UNIT.time),
    continuousVolume: q(at.qc * seconds, UNIT.volume),
    dispersedVolume: q(at.qd * seconds, UNIT.volume),
    emulsionVolume: q((at.qc + at.qd) * seconds, UNIT.volume),
    dispersedFraction: q(at.qd / (at.qc + at.qd), UNIT.none),
  }
}
