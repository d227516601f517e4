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
import { confinedDropPressure, taylorRelativeViscosity } from '../twophase/droplets'
import type { Metres, NewtonsPerMetre, PascalSeconds, Radians } from '../units'
import { CORE_KIND } from './junctions'
import type { ResolvedOperatingPoint } from './operating-point'
import { labelPhases, type ChannelPhase, type NodeTable, type PhaseMap } from './phases'
import { DocumentSolver } from './solveProblem'
import type {
  CompiledChannel,
  CompiledDocument,
  CompiledJunction,
  DocumentForecastOptions,
  DocumentWarning,
} from './types'

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
/**
 * Under-relaxation of the drops' added resistance between iterations, halved (to at most 1/16) whenever the
 * change grows. Measured here: 0.5 fixed took 14 and 8 iterations on the documented T-junction (80 mbar) and the
 * 512-nozzle chip, 0.85 took 5 and 5, 1.0 (none) 9 and 4; near a dispersed arm's onset only the halving settles it.
 */
const RELAXATION = 0.85

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
  /** The solver, for further solves of the same chip (the operating window). */
  solver: DocumentSolver
  arms: JunctionArm[]
  coupling: { method: string; tolerance: number; iterations: number; converged: boolean; change: number }
  warnings: DocumentWarning[]
}

const area = (ch: CompiledChannel) =>
  'diameter' in ch ? (Math.PI * (ch as { diameter: number }).diameter ** 2) / 4 : ch.width * ch.depth
const smallest = (ch: CompiledChannel) =>
  'diameter' in ch ? (ch as { diameter: number }).diameter : Math.min(ch.width, ch.depth)

export function continuousFlow(j: CompiledJunction, flow: ArrayLike<number> | ((k: number) => number)): number {
  const at = typeof flow === 'function' ? flow : (k: number) => (k >= 0 ? flow[k]! : 0)
  // Summed arms, or the largest crossflow past a step (no array built: this runs per junction per pass).
  let value = 0
  for (const k of j.continuous) value = j.continuousRule === 'sum' ? value + at(k) : Math.max(value, Math.abs(at(k)))
  return value
}

export function resolvedAt(j: CompiledJunction, op: ResolvedOperatingPoint, qc: number, qd: number): ResolvedJunction {
  const resolved: ResolvedJunction = {
    kind: CORE_KIND[j.kind],
    mainWidth: j.mainWidth,
    inletWidth: j.inletWidth,
    depth: j.depth,
    continuous: op.continuous,
    dispersed: op.dispersed,
    interfacialTension: op.interfacialTension!,
    temperature: op.temperature,
    flowContinuous: qc,
    flowDispersed: qd,
  }
  if (op.contactAngle !== undefined) resolved.contactAngle = op.contactAngle
  return resolved
}

/** Drops per second and drop volume flux entering each emulsion channel, carried downhill from every junction. */
function carryDrops(
  compiled: CompiledDocument,
  nodes: NodeTable,
  phases: PhaseMap,
  flow: Float64Array,
  op: ResolvedOperatingPoint,
  zero: number,
): { rate: Float64Array; volume: Float64Array } {
  const { channels, junctions } = compiled
  const rate = new Float64Array(channels.length)
  const volume = new Float64Array(channels.length)
  const inRate = new Float64Array(nodes.count)
  const inVolume = new Float64Array(nodes.count)
  let any = false
  junctions.forEach((j, k) => {
    const centre = phases.centre[k]
    if (centre === undefined || !op.interfacialTension) return
    const qd = flow[j.dispersed]!
    const qc = continuousFlow(j, flow)
    if (!(qd > zero) || !(qc > zero)) return
    const train = dropTrain(resolvedAt(j, op, qc, qd))
    if (!(train.volume > 0) || !Number.isFinite(train.frequency)) return
    const c = nodes.index.get(centre)!
    inRate[c]! += train.frequency
    inVolume[c]! += qd
    any = true
  })
  if (!any) return { rate, volume }
  // Outgoing emulsion channels per node (by flow direction). Flow runs downhill, so these edges form a DAG:
  // nodes are visited in topological order (Kahn 1962, Commun. ACM 5, 558), each after all that feed it.
  const outStart = new Int32Array(nodes.count + 1)
  const upstream = (k: number) => (flow[k]! > 0 ? nodes.from[k]! : nodes.to[k]!)
  const downstream = (k: number) => (flow[k]! > 0 ? nodes.to[k]! : nodes.from[k]!)
  const carries = (k: number) => phases.phase[k] === 'emulsion' && Math.abs(flow[k]!) > zero
  const waiting = new Int32Array(nodes.count)
  for (let k = 0; k < channels.length; k++) if (carries(k)) (outStart[upstream(k) + 1]!++, waiting[downstream(k)]!++)
  for (let i = 0; i < nodes.count; i++) outStart[i + 1]! += outStart[i]!
  const fill = outStart.slice(0, nodes.count)
  const outList = new Int32Array(outStart[nodes.count]!)
  for (let k = 0; k < channels.length; k++) if (carries(k)) outList[fill[upstream(k)]!++] = k
  const ready = new Int32Array(nodes.count)
  let head = 0
  let tail = 0
  for (let i = 0; i < nodes.count; i++) if (waiting[i] === 0) ready[tail++] = i
  while (head < tail) {
    const node = ready[head++]!
    for (let e = outStart[node]!; e < outStart[node + 1]!; e++)
      if (--waiting[downstream(outList[e]!)]! === 0) ready[tail++] = downstream(outList[e]!)
    const r = inRate[node]!
    if (r <= 0 || outStart[node] === outStart[node + 1]) continue
    const v = inVolume[node]!
    let total = 0
    for (let e = outStart[node]!; e < outStart[node + 1]!; e++) total += Math.abs(flow[outList[e]!]!)
    for (let e = outStart[node]!; e < outStart[node + 1]!; e++) {
      const k = outList[e]!
      const share = Math.abs(flow[k]!) / total
      rate[k] = r * share
      volume[k] = v * share
      const next = downstream(k)
      inRate[next]! += r * share
      inVolume[next]! += v * share
    }
  }
  return { rate, volume }
}

/** Pressure the drops add to channel k (Pa). */
function dropPressure(
  ch: CompiledChannel,
  q: number,
  rate: number,
  volumeFlux: number,
  base: number,
  op: ResolvedOperatingPoint,
): number {
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
  const { nodes } = phases
  // Feed regions: channels joined at nodes other than junction centres (union–find with path halving).
  const centre = new Uint8Array(nodes.count)
  for (const c of phases.centre) if (c !== undefined) centre[nodes.index.get(c)!] = 1
  const arm = new Uint8Array(channels.length)
  for (const j of junctions) if (j.dispersed >= 0) arm[j.dispersed] = 1
  const parent = Int32Array.from({ length: nodes.count }, (_, i) => i)
  const root = (x: number): number => {
    while (parent[x] !== x) ((parent[x] = parent[parent[x]!]!), (x = parent[x]!))
    return x
  }
  for (let k = 0; k < channels.length; k++) {
    const a = nodes.from[k]!,
      b = nodes.to[k]!
    if (arm[k] || centre[a] || centre[b]) continue
    const ra = root(a),
      rb = root(b)
    if (ra !== rb) parent[ra] = rb
  }
  const pressureOf = new Map<number, string>()
  for (const s of sources) {
    if (s.mode !== 'pressure') continue
    const r = root(nodes.index.get(s.node)!)
    // Prefer an inlet over an outlet when a region touches both.
    if (!pressureOf.has(r) || s.kind === 'inlet') pressureOf.set(r, s.node)
  }
  const forced = new Set<number>()
  junctions.forEach((j, k) => {
    if (j.dispersed < 0) return
    const found = pressureOf.get(root(nodes.from[j.dispersed]!))
    if (found === undefined) forced.add(k)
    else upstream[k] = found
  })
  return forced
}

export function solveTwoPhase(
  doc: ChipDocument,
  compiled: CompiledDocument,
  op: ResolvedOperatingPoint,
  options: DocumentForecastOptions,
): TwoPhaseSolution {
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
  const arms: JunctionArm[] = junctions.map(j => {
    const arm: JunctionArm = { state: 'open' }
    if (j.dispersed < 0 || op.contactAngle === undefined || !op.interfacialTension) return arm
    const constriction = (
      CORE_KIND[j.kind] === 't-junction' ? Math.min(j.inletWidth, j.mainWidth) : j.mainWidth
    ) as Metres
    const barrier = entryBarrier(
      op.interfacialTension.value as NewtonsPerMetre,
      op.contactAngle as Radians,
      constriction,
      j.depth as Metres,
    )
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
  const updateArms = (flow: Float64Array): boolean => {
    let changed = false
    junctions.forEach((j, k) => {
      const arm = arms[k]!
      if (arm.barrier === undefined) return
      const drive = pressure[nodes.from[j.dispersed]!]! - pressure[nodes.to[j.dispersed]!]!
      arm.drive = drive
      // A flow-driven feed that only this arm drains cannot stall: its pump pushes through the barrier.
      const forced = forcedArms.has(k)
      const next: ArmState =
        arm.state === 'open' && flow[j.dispersed]! >= 0
          ? 'open'
          : drive > arm.barrier || forced
            ? 'open'
            : drive < 0
              ? 'backflow'
              : 'below-barrier'
      if (next !== arm.state) ((arm.state = next), (changed = true))
    })
    return changed
  }

  const solver = new DocumentSolver(doc, compiled)
  const nodes = phases.nodes
  const pressure = new Float64Array(nodes.count)
  const added = new Float64Array(n) // Pa·s/m³ the drops add
  const resistance = new Float64Array(n)
  const dropletPressure = new Float64Array(n)
  let solution!: NetworkSolution
  let flow: Float64Array = new Float64Array(n)
  let previous: Float64Array | undefined
  let iterations = 0
  let change = Number.POSITIVE_INFINITY
  let converged = false
  let relaxation = RELAXATION
  let lastChange = Number.POSITIVE_INFINITY
  const nodeMaps = new Map<string[], Int32Array>()
  const solve = () => {
    for (let k = 0; k < n; k++) resistance[k] = base[k]! + added[k]!
    solution = solver.solve(resistance, offset, closed)
    flow = solution.flow
    // Pressures by our own node numbering (one map per solver topology: its nodeIds array is reused).
    let map = nodeMaps.get(solution.nodeIds)
    if (!map) nodeMaps.set(solution.nodeIds, (map = Int32Array.from(solution.nodeIds, id => nodes.index.get(id)!)))
    for (let i = 0; i < map.length; i++) pressure[map[i]!] = solution.pressure[i]!
  }
  applyArms()
  const maxIterations = options.maxCouplingIterations ?? COUPLING_MAX_ITERATIONS
  while (iterations < maxIterations) {
    iterations++
    solve()
    // Settle the entry barriers at these resistances (each arm changes state at most twice).
    for (let pass = 0; pass < 2 * junctions.length + 2 && updateArms(flow); pass++) (applyArms(), solve())
    const scale = Math.max(0, ...solution.sources.map(s => Math.abs(s.flow)))
    const zero = 1e-9 * scale
    if (previous) {
      change = 0
      for (let k = 0; k < n; k++) change = Math.max(change, Math.abs(flow[k]! - previous[k]!))
      change = scale > 0 ? change / scale : 0
      if (change > lastChange) relaxation = Math.max(RELAXATION / 16, relaxation / 2)
      lastChange = change
      if (change < COUPLING_TOLERANCE) {
        converged = true
        break
      }
    }
    previous = Float64Array.from(flow)
    const drops = carryDrops(compiled, nodes, phases, flow, op, zero)
    let any = false
    for (let k = 0; k < n; k++) {
      const q = Math.abs(flow[k]!)
      const dp =
        phases.phase[k] === 'emulsion'
          ? dropPressure(channels[k]!, flow[k]!, drops.rate[k]!, drops.volume[k]!, base[k]!, op)
          : 0
      const target = q > zero && dp > 0 ? dp / q : 0
      if (target > 0 || added[k]! > 0) any = true
      added[k] =
        previous === undefined || iterations === 1 ? target : relaxation * target + (1 - relaxation) * added[k]!
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
    for (let pass = 0; pass < 2 * junctions.length + 2 && updateArms(flow); pass++) (applyArms(), solve())
    warnings.push({
      code: 'two-phase-not-converged',
      message: `The coupled drops–flows iteration did not settle within ${maxIterations} iterations (last relative change ${change.toExponential(2)}, tolerance ${COUPLING_TOLERANCE}); flows and pressures are given WITHOUT the drops' added resistance and marked invalid`,
    })
  }
  for (let k = 0; k < n; k++) dropletPressure[k] = added[k]! * Math.abs(flow[k]!)
  return {
    solution,
    resistance,
    base,
    dropletPressure,
    offset,
    phases,
    viscosity,
    arms,
    solver,
    coupling: {
      method: 'damped-fixed-point',
      tolerance: COUPLING_TOLERANCE,
      iterations,
      converged,
      change: Number.isFinite(change) ? change : 0,
    },
    warnings,
  }
}

export type { ChannelPhase }
