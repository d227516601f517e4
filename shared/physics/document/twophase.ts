// The two-phase network: every channel carries its own phase's liquid, channels downstream of a junction the
// continuous phase with the junction's drops (their added resistance from twophase/droplets.ts), and each
// dispersed arm with a contact angle holds its capillary entry barrier. Drops depend on the flows and the flows
// on the drops: solved by a damped fixed-point iteration to a stated tolerance.
import type { ChipDocument } from '../../schemas/chip'
import { channelResistance } from '../forecast/network'
import { dropTrain } from '../forecast/junction'
import type { ResolvedJunction } from '../forecast/types'
import { entryBarrier } from '../junction/laplace'
import type { NetworkSolution } from '../network'
import type { Method } from '../quantity'
import { confinedDropPressure, DILUTE_LIMIT, taylorRelativeViscosity } from '../twophase/droplets'
import type { Metres, NewtonsPerMetre, PascalSeconds, Radians } from '../units'
import { CORE_KIND } from './junctions'
import type { ResolvedOperatingPoint } from './operating-point'
import { labelPhases, type ChannelPhase, type PhaseMap } from './phases'
import { solveProblem } from './solveProblem'
import type { CompiledChannel, CompiledDocument, CompiledJunction, DocumentForecastOptions, DocumentWarning } from './types'

export const TWO_PHASE: Method = {
  id: 'two-phase-network',
  source:
    'each channel carries the liquid of its phase (feed lines the dispersed or continuous liquid, channels after a junction the continuous ' +
    'phase with drops); drops add resistance (Fuerstman et al. 2007, Lab Chip 7, 1479, caps by Bretherton 1961; dilute drops by Taylor 1932); ' +
    'dispersed arms hold their capillary entry barrier; coupled flows and drops solved by damped fixed-point iteration',
}

/** Relative change of every flow (against the largest) below which the coupled iteration has converged. */
export const COUPLING_TOLERANCE = 1e-6
export const COUPLING_MAX_ITERATIONS = 60
/** Under-relaxation of the drops' added resistance between iterations (measured here: 0.5 converges on every test chip). */
const RELAXATION = 0.5

export type ArmState = 'open' | 'below-barrier' | 'backflow'

export interface JunctionArm {
  /** Entry barrier of the dispersed arm, Pa (only with a contact angle > 90° and a tension). */
  barrier?: number
  state: ArmState
  /** Pressure across the arm at the solution, Pa (upstream terminal − centre). */
  drive?: number
  /** The pressure source upstream of the arm (its feed's pressure-driven inlet), when there is one. */
  source?: string
}

export interface TwoPhaseSolution {
  solution: NetworkSolution
  /** Total resistance per channel (Pa·s/m³): its liquid's plus the drops'. */
  resistance: Float64Array
  /** Its liquid's alone, without drops. */
  base: Float64Array
  /** Pa added by the drops in each channel. */
  dropletPressure: Float64Array
  /** Entry barrier held by each channel, Pa (0 for all but open dispersed arms). */
  offset: Float64Array
  phases: PhaseMap
  viscosity: Float64Array
  arms: JunctionArm[]
  coupling: { method: string; tolerance: number; iterations: number; converged: boolean; change: number }
  warnings: DocumentWarning[]
}

const area = (ch: CompiledChannel) => ('diameter' in ch ? (Math.PI * (ch as { diameter: number }).diameter ** 2) / 4 : ch.width * ch.depth)
const smallest = (ch: CompiledChannel) => ('diameter' in ch ? (ch as { diameter: number }).diameter : Math.min(ch.width, ch.depth))

function continuousFlow(j: CompiledJunction, flow: Float64Array): number {
  const at = (k: number) => (k >= 0 ? flow[k]! : 0)
  return j.continuousRule === 'sum' ? j.continuous.reduce((sum, k) => sum + at(k), 0) : Math.max(...j.continuous.map((k) => Math.abs(at(k))))
}

export function resolvedAt(j: CompiledJunction, op: ResolvedOperatingPoint, qc: number, qd: number): ResolvedJunction {
  const resolved: ResolvedJunction = {
    kind: CORE_KIND[j.kind], mainWidth: j.mainWidth, inletWidth: j.inletWidth, depth: j.depth,
    continuous: op.continuous, dispersed: op.dispersed, interfacialTension: op.interfacialTension!,
    temperature: op.temperature, flowContinuous: qc, flowDispersed: qd,
  }
  if (op.contactAngle !== undefined) resolved.contactAngle = op.contactAngle
  return resolved
}

/** Drops per second and drop volume flux entering each emulsion channel, carried downhill from every junction. */
function carryDrops(compiled: CompiledDocument, phases: PhaseMap, solution: NetworkSolution, flow: Float64Array, op: ResolvedOperatingPoint, zero: number): { rate: Float64Array; volume: Float64Array } {
  const { channels, junctions } = compiled
  const rate = new Float64Array(channels.length)
  const volume = new Float64Array(channels.length)
  const pressure = new Map<string, number>()
  solution.nodeIds.forEach((id, i) => pressure.set(id, solution.pressure[i]!))
  const inRate = new Map<string, number>()
  const inVolume = new Map<string, number>()
  const add = (m: Map<string, number>, node: string, x: number) => m.set(node, (m.get(node) ?? 0) + x)
  junctions.forEach((j, k) => {
    const centre = phases.centre[k]
    if (centre === undefined || !op.interfacialTension) return
    const qd = flow[j.dispersed]!
    const qc = continuousFlow(j, flow)
    if (!(qd > zero) || !(qc > zero)) return
    const train = dropTrain(resolvedAt(j, op, qc, qd))
    if (!(train.volume > 0) || !Number.isFinite(train.frequency)) return
    add(inRate, centre, train.frequency)
    add(inVolume, centre, qd)
  })
  if (inRate.size === 0) return { rate, volume }
  // Outgoing emulsion channels per node, by flow direction.
  const outgoing = new Map<string, number[]>()
  channels.forEach((ch, k) => {
    if (phases.phase[k] !== 'emulsion' || Math.abs(flow[k]!) <= zero) return
    const node = flow[k]! > 0 ? ch.from : ch.to
    const list = outgoing.get(node)
    if (list) list.push(k)
    else outgoing.set(node, [k])
  })
  const nodes = [...outgoing.keys()].sort((a, b) => (pressure.get(b) ?? 0) - (pressure.get(a) ?? 0))
  for (const node of nodes) {
    const r = inRate.get(node) ?? 0
    const v = inVolume.get(node) ?? 0
    if (r <= 0) continue
    const out = outgoing.get(node)!
    const total = out.reduce((sum, k) => sum + Math.abs(flow[k]!), 0)
    for (const k of out) {
      const share = Math.abs(flow[k]!) / total
      rate[k] = r * share
      volume[k] = v * share
      const ch = channels[k]!
      const next = flow[k]! > 0 ? ch.to : ch.from
      add(inRate, next, r * share)
      add(inVolume, next, v * share)
    }
  }
  return { rate, volume }
}

/** Pressure the drops add to channel k (Pa). */
function dropPressure(ch: CompiledChannel, q: number, rate: number, volumeFlux: number, base: number, op: ResolvedOperatingPoint): number {
  const flux = Math.abs(q)
  if (!(rate > 0) || !(flux > 0) || !op.interfacialTension) return 0
  const a = area(ch)
  const dropVolume = volumeFlux / rate
  const diameter = Math.cbrt((6 * dropVolume) / Math.PI)
  const tension = op.interfacialTension.value
  const muC = op.continuous.viscosity.value
  if (diameter >= smallest(ch)) {
    const count = (rate * ch.length * a) / flux
    return count * confinedDropPressure(muC, flux / a, tension, smallest(ch) / 2)
  }
  const fraction = Math.min(volumeFlux / flux, 1)
  return (taylorRelativeViscosity(fraction, op.dispersed.viscosity.value / muC) - 1) * base * flux
}

/**
 * Junctions whose dispersed arm is fed only by flow sources (no pressure source upstream): a pump pushes
 * through the barrier, so the arm never stalls (and closing it would leave the feed without a way out).
 */
function feedOnlyByFlow(compiled: CompiledDocument, phases: PhaseMap, upstream: (string | undefined)[]): Set<number> {
  const { channels, junctions, sources } = compiled
  const adjacency = new Map<string, number[]>()
  channels.forEach((ch, k) => {
    for (const node of [ch.from, ch.to]) (adjacency.get(node) ?? adjacency.set(node, []).get(node)!).push(k)
  })
  const mode = new Map(sources.map((s) => [s.node, s.mode]))
  const centres = new Set(phases.centre.filter((c): c is string => c !== undefined))
  const forced = new Set<number>()
  junctions.forEach((j, k) => {
    if (j.dispersed < 0) return
    const start = channels[j.dispersed]!.from
    const seen = new Set([start])
    const queue = [start]
    let pressure = false
    while (queue.length && !pressure) {
      const node = queue.pop()!
      if (mode.get(node) === 'pressure') ((pressure = true), (upstream[k] = node))
      if (mode.has(node) && node !== start) continue
      for (const c of adjacency.get(node) ?? []) {
        if (c === j.dispersed) continue
        const next = channels[c]!.from === node ? channels[c]!.to : channels[c]!.from
        if (seen.has(next) || centres.has(next)) continue
        seen.add(next)
        queue.push(next)
      }
    }
    if (!pressure) forced.add(k)
  })
  return forced
}

export function solveTwoPhase(doc: ChipDocument, compiled: CompiledDocument, op: ResolvedOperatingPoint, options: DocumentForecastOptions): TwoPhaseSolution {
  const method = options.resistanceMethod ?? 'series'
  const { channels, junctions } = compiled
  const phases = labelPhases(doc, compiled)
  const warnings: DocumentWarning[] = [...phases.warnings]
  const n = channels.length
  const viscosity = new Float64Array(n)
  const base = new Float64Array(n)
  channels.forEach((ch, k) => {
    const liquid = phases.phase[k] === 'dispersed' ? op.dispersed : op.continuous
    viscosity[k] = liquid.viscosity.value
    base[k] = channelResistance(ch, viscosity[k]! as PascalSeconds, method).value
  })

  // Entry barriers of dispersed arms (contact angle > 90°: the continuous phase wets, the dispersed must be pushed in).
  const arms: JunctionArm[] = junctions.map((j) => {
    const arm: JunctionArm = { state: 'open' }
    if (j.dispersed < 0 || op.contactAngle === undefined || !op.interfacialTension) return arm
    const constriction = (CORE_KIND[j.kind] === 't-junction' ? Math.min(j.inletWidth, j.mainWidth) : j.mainWidth) as Metres
    const barrier = entryBarrier(op.interfacialTension.value as NewtonsPerMetre, op.contactAngle as Radians, constriction, j.depth as Metres)
    if (barrier > 0) arm.barrier = barrier
    return arm
  })
  const offset = new Float64Array(n)
  const closed = new Set<number>()
  const applyArms = () => {
    offset.fill(0)
    closed.clear()
    junctions.forEach((j, k) => {
      const arm = arms[k]!
      if (arm.barrier === undefined) return
      if (arm.state === 'open') offset[j.dispersed] = arm.barrier
      else if (arm.state === 'below-barrier') closed.add(j.dispersed)
    })
  }
  const upstream: (string | undefined)[] = new Array(junctions.length).fill(undefined)
  const forcedArms = feedOnlyByFlow(compiled, phases, upstream)
  arms.forEach((arm, k) => upstream[k] !== undefined && (arm.source = upstream[k]))
  /** Moves each barrier arm to the state its pressures call for; true when any changed. */
  const updateArms = (solution: NetworkSolution, flow: Float64Array): boolean => {
    const pressure = new Map(solution.nodeIds.map((id, i) => [id, solution.pressure[i]!]))
    let changed = false
    junctions.forEach((j, k) => {
      const arm = arms[k]!
      if (arm.barrier === undefined) return
      const ch = channels[j.dispersed]!
      const drive = (pressure.get(ch.from) ?? 0) - (pressure.get(ch.to) ?? 0)
      arm.drive = drive
      // A flow-driven feed that only this arm drains cannot stall: its pump pushes through the barrier.
      const forced = forcedArms.has(k)
      const next: ArmState = arm.state === 'open' && flow[j.dispersed]! >= 0 ? 'open'
        : drive > arm.barrier || forced ? 'open' : drive < 0 ? 'backflow' : 'below-barrier'
      if (next !== arm.state) ((arm.state = next), (changed = true))
    })
    return changed
  }

  const added = new Float64Array(n) // Pa·s/m³ the drops add
  const resistance = new Float64Array(n)
  const dropletPressure = new Float64Array(n)
  let solution!: NetworkSolution
  let flow: Float64Array = new Float64Array(n)
  let previous: Float64Array | undefined
  let iterations = 0
  let change = Number.POSITIVE_INFINITY
  let converged = false
  const solve = () => {
    for (let k = 0; k < n; k++) resistance[k] = base[k]! + added[k]!
    solution = solveProblem(doc, compiled, resistance, offset, closed)
    flow = solution.flow
  }
  applyArms()
  const maxIterations = options.maxCouplingIterations ?? COUPLING_MAX_ITERATIONS
  while (iterations < maxIterations) {
    iterations++
    solve()
    // Settle the entry barriers at these resistances (each arm changes state at most twice).
    for (let pass = 0; pass < 2 * junctions.length + 2 && updateArms(solution, flow); pass++) (applyArms(), solve())
    const scale = Math.max(0, ...solution.sources.map((s) => Math.abs(s.flow)))
    const zero = 1e-9 * scale
    if (previous) {
      change = 0
      for (let k = 0; k < n; k++) change = Math.max(change, Math.abs(flow[k]! - previous[k]!))
      change = scale > 0 ? change / scale : 0
      if (change < COUPLING_TOLERANCE) {
        converged = true
        break
      }
    }
    previous = Float64Array.from(flow)
    const drops = carryDrops(compiled, phases, solution, flow, op, zero)
    let any = false
    for (let k = 0; k < n; k++) {
      const q = Math.abs(flow[k]!)
      const dp = phases.phase[k] === 'emulsion' ? dropPressure(channels[k]!, flow[k]!, drops.rate[k]!, drops.volume[k]!, base[k]!, op) : 0
      const target = q > zero && dp > 0 ? dp / q : 0
      if (target > 0 || added[k]! > 0) any = true
      added[k] = previous === undefined || iterations === 1 ? target : RELAXATION * target + (1 - RELAXATION) * added[k]!
    }
    if (!any && iterations > 1) {
      converged = true
      change = 0
      break
    }
  }
  if (!converged) {
    // Fall back to the solve without drops (each channel still with its own liquid), and say so.
    added.fill(0)
    solve()
    updateArms(solution, flow)
    warnings.push({ code: 'two-phase-not-converged', message: `The coupled drops–flows iteration did not settle within ${maxIterations} iterations (last relative change ${change.toExponential(2)}, tolerance ${COUPLING_TOLERANCE}); flows and pressures are given WITHOUT the drops' added resistance and marked invalid` })
  }
  for (let k = 0; k < n; k++) dropletPressure[k] = added[k]! * Math.abs(flow[k]!)
  return {
    solution, resistance, base, dropletPressure, offset, phases, viscosity, arms,
    coupling: { method: 'damped-fixed-point', tolerance: COUPLING_TOLERANCE, iterations, converged, change: Number.isFinite(change) ? change : 0 },
    warnings,
  }
}

export type { ChannelPhase }
