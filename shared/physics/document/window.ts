// The operating window in pressure: for each pressure-driven dispersed inlet, the range of its pressure (every
// other setting held) over which its junctions make drops — from the entry barrier to jetting or backflow.
import type { ChipDocument } from '../../schemas/chip'
import { breakupGroups } from '../forecast/junction'
import { quantity, type Method } from '../quantity'
import { UNIT } from '../units'
import type { ResolvedOperatingPoint } from './operating-point'
import { solveProblem } from './solveProblem'
import { resolvedAt, type TwoPhaseSolution } from './twophase'
import type { CompiledDocument, CompiledJunction, DocumentForecastOptions, OperatingWindow } from './types'

export const OPERATING_WINDOW: Method = {
  id: 'pressure-operating-window',
  source:
    'flows linear in the inlet pressure at the converged resistances (drops held as at the set point), each dispersed arm open with its ' +
    'entry barrier: lower edge where its flow reaches zero (the barrier), upper edge where a junction jets (regime criterion) or its continuous flow reverses',
}

/** Highest pressure searched, Pa (10 bar), unless a bond or pump limit is lower. Common practice, no source. */
const SEARCH_LIMIT = 1e6

const continuousFlow = (j: CompiledJunction, flow: (k: number) => number) =>
  j.continuousRule === 'sum' ? j.continuous.reduce((sum, k) => sum + flow(k), 0) : Math.max(...j.continuous.map((k) => Math.abs(flow(k))))

export function operatingWindows(doc: ChipDocument, compiled: CompiledDocument, solved: TwoPhaseSolution, op: ResolvedOperatingPoint, options: DocumentForecastOptions): OperatingWindow[] {
  if (!op.interfacialTension || !solved.coupling.converged) return []
  const windows: OperatingWindow[] = []
  for (const source of compiled.sources) {
    if (source.kind !== 'inlet' || source.mode !== 'pressure' || solved.phases.inletPhase.get(source.port) !== 'dispersed') continue
    const fed = compiled.junctions.map((j, k) => ({ j, k })).filter(({ j, k }) => j.dispersed >= 0 && solved.arms[k]!.source === source.node)
    if (!fed.length) continue
    const offset = Float64Array.from(solved.offset)
    const closed = new Set<number>()
    compiled.junctions.forEach((j, k) => {
      const arm = solved.arms[k]!
      const mine = fed.some((f) => f.k === k)
      if (arm.barrier !== undefined && (mine || arm.state === 'open')) offset[j.dispersed] = arm.barrier
      else if (arm.state === 'below-barrier') closed.add(j.dispersed)
    })
    const at = (pressure: number, resistance: Float64Array) => {
      const sources = compiled.sources.map((s) => (s === source ? { ...s, pressure } : s))
      return solveProblem(doc, { ...compiled, sources }, resistance, offset, closed).flow
    }
    const p0 = source.pressure
    const step = Math.max(100, 0.1 * Math.abs(p0))
    // Lower edge, where the first drop forms, so no drops yet: the liquids' resistances alone.
    const b0 = at(p0, solved.base)
    const b1 = at(p0 + step, solved.base)
    let from = Number.POSITIVE_INFINITY
    for (const { j } of fed) {
      const slope = (b1[j.dispersed]! - b0[j.dispersed]!) / step
      if (slope > 0) from = Math.min(from, p0 - b0[j.dispersed]! / slope)
    }
    // Upper edge: drops held as at the set point.
    const q0 = at(p0, solved.resistance)
    const q1 = at(p0 + step, solved.resistance)
    const flowAt = (pressure: number) => (k: number) => (k >= 0 ? q0[k]! + ((q1[k]! - q0[k]!) / step) * (pressure - p0) : 0)
    if (!Number.isFinite(from)) continue
    const limits = [SEARCH_LIMIT, options.limits?.bondPressure, options.limits?.pumpPressure].filter((x): x is number => x !== undefined)
    const top = Math.max(Math.min(...limits), from)
    const stops = (pressure: number): 'jetting' | 'continuous-backflow' | undefined => {
      const flow = flowAt(pressure)
      for (const { j } of fed) {
        const qd = flow(j.dispersed)
        const qc = continuousFlow(j, flow)
        if (qc <= 0) return 'continuous-backflow'
        if (qd > 0 && breakupGroups(resolvedAt(j, op, qc, qd)).regime.value === 'jetting') return 'jetting'
      }
      return undefined
    }
    let limitedBy: OperatingWindow['limitedBy'] = 'pressure-limit'
    let to = top
    const reason = stops(top)
    if (reason) {
      // Bisect for the first stop above the lower edge (both stops grow with the dispersed pressure).
      let lo = from
      let hi = top
      for (let i = 0; i < 60 && hi - lo > 1e-6 * Math.max(1, hi); i++) {
        const mid = (lo + hi) / 2
        if (stops(mid)) hi = mid
        else lo = mid
      }
      to = hi
      limitedBy = stops(hi) ?? reason
    }
    windows.push({
      port: source.port,
      from: quantity(from, UNIT.pressure, OPERATING_WINDOW),
      to: quantity(to, UNIT.pressure, OPERATING_WINDOW),
      limitedBy,
      current: quantity(p0, UNIT.pressure, OPERATING_WINDOW),
      junctions: fed.map(({ j }) => j.id),
    })
  }
  return windows
}
