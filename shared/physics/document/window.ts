// The operating window in pressure: for each pressure-driven dispersed inlet, the range of its pressure (every
// other setting held) over which its junctions make drops — from the entry barrier to jetting or backflow.
import type { ChipDocument } from '../../schemas/chip'
import { breakupGroups } from '../forecast/junction'
import type { ResolvedJunction } from '../forecast/types'
import { isJetting } from '../junction/regime'
import { quantity, type Method } from '../quantity'
import { UNIT } from '../units'
import type { ResolvedOperatingPoint } from './operating-point'
import { continuousFlow, resolvedAt, type TwoPhaseSolution } from './twophase'
import type { CompiledDocument, CompiledJunction, DocumentForecastOptions, OperatingWindow } from './types'

export { jettingTest }

export const OPERATING_WINDOW: Method = {
  id: 'pressure-operating-window',
  source:
    'flows linear in the inlet pressure at the converged resistances (drops held as at the set point), each dispersed arm open with its ' +
    'entry barrier: lower edge where its flow reaches zero (the barrier), upper edge where a junction jets (regime criterion) or its continuous flow reverses',
}

/** Highest pressure searched, Pa (10 bar), unless a bond or pump limit is lower. Common practice, no source. */
const SEARCH_LIMIT = 1e6

/** A junction's jetting verdict as a function of its two flows (the groups of breakupGroups, checked equal in tests). */
function jettingTest(j: CompiledJunction, op: ResolvedOperatingPoint): (qc: number, qd: number) => boolean {
  const probe: ResolvedJunction = resolvedAt(j, op, 1, 1)
  const unit = breakupGroups(probe)
  // Ca is linear in its flow and We quadratic in Qd (junction/dimensionless.ts): scale the unit-flow groups.
  const step = probe.kind === 'step'
  return (qc, qd) => isJetting(probe.kind, unit.ca * (step ? qd : qc), unit.we * qd * qd)
}

export function operatingWindows(
  doc: ChipDocument,
  compiled: CompiledDocument,
  solved: TwoPhaseSolution,
  op: ResolvedOperatingPoint,
  options: DocumentForecastOptions,
): OperatingWindow[] {
  if (!op.interfacialTension || !solved.coupling.converged) return []
  const windows: OperatingWindow[] = []
  let baseAtSetPoint: Float64Array | undefined
  for (const source of compiled.sources) {
    if (
      source.kind !== 'inlet' ||
      source.mode !== 'pressure' ||
      solved.phases.inletPhase.get(source.port) !== 'dispersed'
    )
      continue
    const fed = compiled.junctions
      .map((j, k) => ({ j, k }))
      .filter(({ j, k }) => j.dispersed >= 0 && solved.arms[k]!.source === source.node)
    if (!fed.length) continue
    const offset = Float64Array.from(solved.offset)
    const zeros = new Float64Array(offset.length)
    const closed = new Set<number>()
    const fedIndex = new Set(fed.map(f => f.k))
    compiled.junctions.forEach((j, k) => {
      const arm = solved.arms[k]!
      const mine = fedIndex.has(k)
      if (arm.barrier !== undefined && (mine || arm.state === 'open')) offset[j.dispersed] = arm.barrier
      else if (arm.state === 'below-barrier') closed.add(j.dispersed)
    })
    // Flows are affine in this inlet's pressure: q(P) = q(p0) + (P − p0) u, u the response to 1 Pa at this
    // inlet with every other source and every barrier at zero (superposition).
    const unitSources = compiled.sources.map(s =>
      s === source ? { ...s, pressure: 1 } : s.mode === 'pressure' ? { ...s, pressure: 0 } : { ...s, flow: 0 },
    )
    const response = (resistance: Float64Array) => solved.solver.solve(resistance, zeros, closed, unitSources).flow
    const p0 = source.pressure
    // Lower edge, where the first drop forms, so no drops yet: the liquids' resistances alone.
    baseAtSetPoint ??= solved.solver.solve(solved.base, offset, closed).flow
    const b0 = baseAtSetPoint
    const ub = response(solved.base)
    let from = Number.POSITIVE_INFINITY
    for (const { j } of fed) if (ub[j.dispersed]! > 0) from = Math.min(from, p0 - b0[j.dispersed]! / ub[j.dispersed]!)
    if (!Number.isFinite(from)) continue
    // Upper edge: drops held as at the set point (with every fed arm open, the converged solution is that solve).
    const asSolved = fed.every(({ k }) => solved.arms[k]!.state === 'open')
    const q0 = asSolved ? solved.solution.flow : solved.solver.solve(solved.resistance, offset, closed).flow
    const u = response(solved.resistance)
    const flowAt = (pressure: number) => (k: number) => (k >= 0 ? q0[k]! + u[k]! * (pressure - p0) : 0)
    const limits = [SEARCH_LIMIT, options.limits?.bondPressure, options.limits?.pumpPressure].filter(
      (x): x is number => x !== undefined,
    )
    const top = Math.max(Math.min(...limits), from)
    const jetting = fed.map(({ j }) => jettingTest(j, op))
    const stops = (pressure: number): 'jetting' | 'continuous-backflow' | undefined => {
      const flow = flowAt(pressure)
      for (let f = 0; f < fed.length; f++) {
        const j = fed[f]!.j
        const qd = flow(j.dispersed)
        const qc = continuousFlow(j, flow)
        if (qc <= 0) return 'continuous-backflow'
        if (qd > 0 && jetting[f]!(qc, qd)) return 'jetting'
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
      for (let i = 0; i < 40 && hi - lo > 1e-3 * Math.max(1, hi); i++) {
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
