// Reads the network half of a chip's answer from its two-phase solve: flows, pressures, liquids, drops' share, inlets, uniformity, margins.
import { KIRCHHOFF, channelResistance } from '../forecast/network'
import { ENTRY_BARRIER } from '../junction/laplace'
import { flowUniformity, pressureMargin, pumpMargin, suctionWarnings } from '../network'
import { quantity, type Method } from '../quantity'
import { CONFINED_DROPS, DILUTE_DROPS } from '../twophase/droplets'
import { UNIT, type PascalSeconds } from '../units'
import type { ResolvedOperatingPoint } from './operating-point'
import { TWO_PHASE, type TwoPhaseSolution } from './twophase'
import type {
  CompiledDocument,
  DocumentChannel,
  DocumentForecastOptions,
  DocumentNetwork,
  DocumentUniformity,
  DocumentWarning,
} from './types'

/**
 * The former approximation, kept for labs that compare with stored forecasts: every channel carried the
 * continuous phase; droplets' added resistance and dispersed-phase viscosity in feed lines were neglected.
 */
export const SINGLE_PHASE: Method = {
  id: 'single-phase-continuous-viscosity',
  source:
    "Every channel carries the continuous phase at the operating point's temperature; droplets' added resistance (Fuerstman et al. 2007, Lab Chip 7, 1479) and dispersed-phase viscosity in feed lines are neglected",
}

const DROPLET_ADDED: Method = {
  id: 'droplet-added-pressure',
  source: `${CONFINED_DROPS.source}; ${DILUTE_DROPS.source}`,
}

export function networkAnswer(
  compiled: CompiledDocument,
  solved: TwoPhaseSolution,
  op: ResolvedOperatingPoint,
  options: DocumentForecastOptions,
): DocumentNetwork {
  const { solution, resistance, dropletPressure, offset, phases, coupling } = solved
  const warnings: DocumentWarning[] = [...op.warnings, ...compiled.warnings, ...solved.warnings]
  const valid = coupling.converged
  // Each source node's pressure and flow, as the solve reports them (no map over every node).
  const atSource = new Map(solution.sources.map(s => [s.node, s]))
  const rectMethod = channelResistance(
    { id: '', from: '', to: '', width: 1, depth: 1, length: 1 },
    1 as PascalSeconds,
    options.resistanceMethod ?? 'series',
  ).method
  const flowMethod = { id: `${KIRCHHOFF.id}+${TWO_PHASE.id}`, source: `${KIRCHHOFF.source}; ${TWO_PHASE.source}` }
  // One method object per kind, not one per channel (2,564 on the 512-nozzle chip).
  const withDrops = {
    id: `${rectMethod.id}+drops`,
    source: `${rectMethod.source}; ${CONFINED_DROPS.source}; ${DILUTE_DROPS.source}`,
  }
  const answer: DocumentNetwork = {
    liquid: op.continuous,
    approximation: TWO_PHASE,
    nodes: solution.nodeIds.map((id, i) => ({
      id,
      pressure: quantity(solution.pressure[i]!, UNIT.pressure, flowMethod, valid),
    })),
    channels: compiled.channels.map((ch, k) => {
      const q = solution.flow[k]!
      const drop = q * resistance[k]!
      const liquid = phases.phase[k]!
      const channel: DocumentChannel = {
        id: ch.id,
        element: ch.element,
        from: ch.from,
        to: ch.to,
        liquid,
        viscosity: liquid === 'dispersed' ? op.dispersed.viscosity : op.continuous.viscosity,
        flow: quantity(q, UNIT.flow, flowMethod, valid),
        resistance: quantity(resistance[k]!, UNIT.resistance, dropletPressure[k]! > 0 ? withDrops : rectMethod, valid),
        pressureDrop: quantity(drop, UNIT.pressure, flowMethod, valid),
        dropletPressureDrop: quantity(Math.sign(q) * dropletPressure[k]!, UNIT.pressure, DROPLET_ADDED, valid),
        dropletShare: drop !== 0 ? Math.min(1, dropletPressure[k]! / Math.abs(drop)) : 0,
      }
      if (offset[k]! > 0) channel.entryBarrier = quantity(offset[k]!, UNIT.pressure, ENTRY_BARRIER)
      return channel
    }),
    inlets: compiled.sources
      .filter(s => s.kind === 'inlet')
      .map(s => ({
        port: s.port,
        node: s.node,
        mode: s.mode,
        phase: phases.inletPhase.get(s.port) ?? 'continuous',
        pressure: quantity(atSource.get(s.node)!.pressure, UNIT.pressure, flowMethod, valid),
        flow: quantity(atSource.get(s.node)!.flow, UNIT.flow, flowMethod, valid),
      })),
    outlets: compiled.sources
      .filter(s => s.kind === 'outlet')
      .map(s => ({
        port: s.port,
        node: s.node,
        flow: quantity(-atSource.get(s.node)!.flow, UNIT.flow, flowMethod, valid),
      })),
    uniformity: uniformity(compiled, solution.flow),
    solver: { name: solution.solver, iterations: solution.iterations, residual: solution.residual },
    coupling,
    operatingWindow: [],
    warnings,
  }
  if (options.limits) {
    const needed = answer.inlets.map(inlet => inlet.pressure.value)
    answer.margins = {}
    if (options.limits.bondPressure !== undefined)
      answer.margins.bondPressure = pressureMargin(options.limits.bondPressure, needed)
    if (options.limits.pumpPressure !== undefined)
      answer.margins.pumpPressure = pumpMargin(options.limits.pumpPressure, needed)
    for (const [name, margin] of Object.entries(answer.margins)) {
      if (!margin.ok)
        warnings.push({
          code: 'pressure-limit',
          message:
            name === 'bondPressure'
              ? `An inlet needs ${(margin.highest / 100).toPrecision(3)} mbar, above the bond limit of ${(margin.limit / 100).toPrecision(3)} mbar; lower the flows, shorten narrow channels or widen them`
              : `An inlet needs ${(margin.highest / 100).toPrecision(3)} mbar of pressure or suction, beyond the pump limit of ${(margin.limit / 100).toPrecision(3)} mbar; lower the flows, shorten narrow channels or widen them`,
        })
    }
  }
  warnings.push(...suctionWarnings(answer.inlets))
  return answer
}

/** Flow uniformity over each set of identical junctions (≥ 2): their dispersed (nozzle) flows. */
function uniformity(compiled: CompiledDocument, flow: Float64Array): DocumentUniformity[] {
  const sets = new Map<string, number[]>()
  compiled.junctions.forEach((j, k) => {
    if (j.dispersed < 0) return
    const list = sets.get(j.parallelKey)
    if (list) list.push(k)
    else sets.set(j.parallelKey, [k])
  })
  const answer: DocumentUniformity[] = []
  for (const members of sets.values()) {
    if (members.length < 2) continue
    const junctions = members.map(k => compiled.junctions[k]!)
    answer.push({
      ...flowUniformity(junctions.map(j => flow[j.dispersed]!)),
      channels: junctions.map(j => compiled.channels[j.dispersed]!.id),
      junctions: junctions.map(j => j.id),
    })
  }
  return answer
}
