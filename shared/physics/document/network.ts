// Solves a compiled chip and reads the network half of the answer: flows, pressures, inlets, uniformity, margins.
import type { ChipDocument } from '../../schemas/chip'
import { ForecastInputError, NetworkError } from '../errors'
import { KIRCHHOFF, channelResistance } from '../forecast/network'
import { flowUniformity, pressureMargin, solveNetwork, type NetworkSolution } from '../network'
import { quantity, type Method } from '../quantity'
import { UNIT, type PascalSeconds } from '../units'
import type { ResolvedOperatingPoint } from './operating-point'
import { documentPath } from './paths'
import type { CompiledDocument, DocumentForecastOptions, DocumentNetwork, DocumentUniformity, DocumentWarning } from './types'

/**
 * One liquid for the pressure budget: every channel carries the continuous phase at the operating point's
 * temperature. Drops add resistance to the channels they travel in (each confined plug adds a Laplace-pressure
 * and film term; Fuerstman et al. 2007, Lab Chip 7, 1479; Jakiela et al. 2011, Phys. Rev. Lett. 107, 194502)
 * and feed lines carrying the dispersed phase have its viscosity; neither is modelled, as is common in
 * design-stage pressure budgets. Inlet pressures are therefore estimates of the single-phase need.
 */
export const SINGLE_PHASE: Method = {
  id: 'single-phase-continuous-viscosity',
  source: 'Every channel carries the continuous phase at the operating point\'s temperature; droplets\' added resistance (Fuerstman et al. 2007, Lab Chip 7, 1479) and dispersed-phase viscosity in feed lines are neglected',
}

export interface SolvedDocument {
  solution: NetworkSolution
  resistance: Float64Array
}

const ELEMENT_LIST_MAX = 10

/** Names the elements a set of nodes belongs to: `channel "a", t-junction "tj-2"`. */
function describeElements(doc: ChipDocument, compiled: CompiledDocument, nodes: readonly string[]): { text: string; path: string } {
  const floating = new Set(nodes)
  const elements: string[] = []
  for (const ch of compiled.channels) if ((floating.has(ch.from) || floating.has(ch.to)) && !elements.includes(ch.element)) elements.push(ch.element)
  const label = (id: string) => {
    const channel = doc.channels.findIndex((c) => c.id === id)
    if (channel >= 0) return { text: `channel "${id}"`, path: documentPath(['channels', channel]) }
    const component = doc.components.findIndex((c) => c.id === id)
    if (component >= 0) return { text: `${doc.components[component]!.kind} "${id}"`, path: documentPath(['components', component]) }
    const port = doc.ports.findIndex((p) => p.id === id)
    return { text: `port "${id}"`, path: documentPath(['ports', Math.max(port, 0)]) }
  }
  const labels = elements.map(label)
  const more = labels.length > ELEMENT_LIST_MAX ? ` and ${labels.length - ELEMENT_LIST_MAX} more` : ''
  return { text: labels.slice(0, ELEMENT_LIST_MAX).map((l) => l.text).join(', ') + more, path: labels[0]?.path ?? 'document' }
}

export function solveCompiled(doc: ChipDocument, compiled: CompiledDocument, op: ResolvedOperatingPoint, options: DocumentForecastOptions): SolvedDocument {
  const viscosity = op.continuous.viscosity.value as PascalSeconds
  const method = options.resistanceMethod ?? 'series'
  const resistance = new Float64Array(compiled.channels.length)
  compiled.channels.forEach((ch, k) => (resistance[k] = channelResistance(ch, viscosity, method).value))
  try {
    const solution = solveNetwork({
      channels: compiled.channels.map((ch, k) => ({ id: ch.id, from: ch.from, to: ch.to, resistance: resistance[k]! })),
      sources: compiled.sources.map((s) => (s.mode === 'pressure' ? { node: s.node, pressure: s.pressure } : { node: s.node, flow: s.flow })),
    })
    return { solution, resistance }
  } catch (error) {
    if (!(error instanceof NetworkError)) throw error
    if (error.code === 'floating') {
      const { text, path } = describeElements(doc, compiled, error.detail.nodes ?? [])
      throw new ForecastInputError([{ path, message: `Not connected to any outlet or pressure-driven inlet, so the pressure there is undetermined: ${text}. Connect these elements to the rest of the chip or delete them` }])
    }
    if (error.code === 'over-constrained') {
      const ports = compiled.sources.filter((s) => error.detail.nodes?.includes(s.node)).map((s) => `"${s.port}"`).join(' and ')
      throw new ForecastInputError([{ path: 'document.ports', message: `Ports ${ports} sit on one node (they touch or coincide), so it gets two settings: move them apart or delete one` }])
    }
    const where = error.detail.channelIndex !== undefined ? compiled.channels[error.detail.channelIndex] : undefined
    throw new ForecastInputError([{ path: 'document', message: where ? `${error.message} (element "${where.element}")` : error.message }])
  }
}

export function networkAnswer(compiled: CompiledDocument, solved: SolvedDocument, op: ResolvedOperatingPoint, options: DocumentForecastOptions): DocumentNetwork {
  const { solution, resistance } = solved
  const warnings: DocumentWarning[] = [...op.warnings, ...compiled.warnings]
  const pressureAt = new Map(solution.nodeIds.map((id, i) => [id, solution.pressure[i]!]))
  const sourceFlow = new Map(solution.sources.map((s) => [s.node, s.flow]))
  const rectMethod = channelResistance({ id: '', from: '', to: '', width: 1, depth: 1, length: 1 }, 1 as PascalSeconds, options.resistanceMethod ?? 'series').method
  const answer: DocumentNetwork = {
    liquid: op.continuous,
    approximation: SINGLE_PHASE,
    nodes: solution.nodeIds.map((id, i) => ({ id, pressure: quantity(solution.pressure[i]!, UNIT.pressure, KIRCHHOFF) })),
    channels: compiled.channels.map((ch, k) => ({
      id: ch.id,
      element: ch.element,
      from: ch.from,
      to: ch.to,
      flow: quantity(solution.flow[k]!, UNIT.flow, KIRCHHOFF),
      resistance: quantity(resistance[k]!, UNIT.resistance, rectMethod),
      pressureDrop: quantity(solution.flow[k]! * resistance[k]!, UNIT.pressure, KIRCHHOFF),
    })),
    inlets: compiled.sources.filter((s) => s.kind === 'inlet').map((s) => ({
      port: s.port,
      node: s.node,
      mode: s.mode,
      pressure: quantity(pressureAt.get(s.node)!, UNIT.pressure, KIRCHHOFF),
      flow: quantity(sourceFlow.get(s.node)!, UNIT.flow, KIRCHHOFF),
    })),
    outlets: compiled.sources.filter((s) => s.kind === 'outlet').map((s) => ({ port: s.port, node: s.node, flow: quantity(-sourceFlow.get(s.node)!, UNIT.flow, KIRCHHOFF) })),
    uniformity: uniformity(compiled, solution.flow),
    solver: { name: solution.solver, iterations: solution.iterations, residual: solution.residual },
    warnings,
  }
  if (options.limits) {
    const needed = answer.inlets.map((inlet) => inlet.pressure.value)
    answer.margins = {}
    if (options.limits.bondPressure !== undefined) answer.margins.bondPressure = pressureMargin(options.limits.bondPressure, needed)
    if (options.limits.pumpPressure !== undefined) answer.margins.pumpPressure = pressureMargin(options.limits.pumpPressure, needed)
    for (const [name, margin] of Object.entries(answer.margins)) {
      if (!margin.ok) warnings.push({ code: 'pressure-limit', message: `An inlet needs ${(margin.highest / 100).toPrecision(3)} mbar, above the ${name === 'bondPressure' ? 'bond' : 'pump'} limit of ${(margin.limit / 100).toPrecision(3)} mbar; lower the flows, shorten narrow channels or widen them` })
    }
  }
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
    const junctions = members.map((k) => compiled.junctions[k]!)
    answer.push({
      ...flowUniformity(junctions.map((j) => flow[j.dispersed]!)),
      channels: junctions.map((j) => compiled.channels[j.dispersed]!.id),
      junctions: junctions.map((j) => j.id),
    })
  }
  return answer
}
