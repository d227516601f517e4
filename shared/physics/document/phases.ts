// Which liquid each compiled channel carries: walk from every inlet without crossing a junction's centre;
// what no inlet reaches lies downstream of a junction and carries the continuous phase with drops in it.
import type { ChipDocument } from '../../schemas/chip'
import type { CompiledDocument, DocumentWarning } from './types'

export type ChannelPhase = 'continuous' | 'dispersed' | 'emulsion'

export interface PhaseMap {
  phase: ChannelPhase[]
  /** Port id → the phase it feeds. */
  inletPhase: Map<string, 'continuous' | 'dispersed'>
  /** Node id of each junction's centre (where its dispersed arm ends), indexed like compiled.junctions. */
  centre: (string | undefined)[]
  warnings: DocumentWarning[]
}

export function labelPhases(doc: ChipDocument, compiled: CompiledDocument): PhaseMap {
  const { channels, junctions, sources } = compiled
  const adjacency = new Map<string, number[]>()
  const link = (node: string, k: number) => {
    const list = adjacency.get(node)
    if (list) list.push(k)
    else adjacency.set(node, [k])
  }
  channels.forEach((ch, k) => (link(ch.from, k), link(ch.to, k)))
  const centre = junctions.map((j) => (j.dispersed >= 0 ? channels[j.dispersed]!.to : undefined))
  const stops = new Set<string>([...centre.filter((c): c is string => c !== undefined), ...sources.map((s) => s.node)])
  const dispersedArms = new Set(junctions.map((j) => j.dispersed).filter((k) => k >= 0))
  const continuousArms = new Set(junctions.flatMap((j) => j.continuous).filter((k) => k >= 0))
  const feeds = new Map(doc.ports.map((p) => [p.id, p.feed?.phase]))

  const phase: (ChannelPhase | undefined)[] = new Array(channels.length).fill(undefined)
  const inletPhase = new Map<string, 'continuous' | 'dispersed'>()
  const warnings: DocumentWarning[] = []
  const mixed = new Set<number>()
  for (const source of sources) {
    if (source.kind !== 'inlet') continue
    const reached: number[] = []
    const seen = new Set<string>([source.node])
    const queue = [source.node]
    while (queue.length) {
      const node = queue.pop()!
      for (const k of adjacency.get(node) ?? []) {
        if (!reached.includes(k)) reached.push(k)
        const ch = channels[k]!
        const next = ch.from === node ? ch.to : ch.from
        if (seen.has(next)) continue
        seen.add(next)
        if (!stops.has(next)) queue.push(next)
      }
    }
    // The port says which phase it carries; without a feed, an inlet that reaches only dispersed arms is dispersed.
    const given = feeds.get(source.port)
    const inferred = reached.some((k) => dispersedArms.has(k)) && !reached.some((k) => continuousArms.has(k)) ? 'dispersed' : 'continuous'
    const liquid = given ?? inferred
    inletPhase.set(source.port, liquid)
    for (const k of reached) {
      if (phase[k] !== undefined && phase[k] !== liquid) mixed.add(k)
      phase[k] = liquid
    }
  }
  for (const k of mixed) {
    phase[k] = 'continuous'
    warnings.push({ code: 'phases-meet', element: channels[k]!.element, message: `Both phases reach "${channels[k]!.id}" without passing a junction, so its liquid is uncertain; it is counted as the continuous phase — check the feeds of the inlets that reach it` })
  }
  return { phase: phase.map((p) => p ?? 'emulsion'), inletPhase, centre, warnings }
}
