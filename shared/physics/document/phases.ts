// Which liquid each compiled channel carries: walk from every inlet without crossing a junction's centre;
// what no inlet reaches lies downstream of a junction and carries the continuous phase with drops in it.
import type { ChipDocument } from '../../schemas/chip'
import type { CompiledDocument, DocumentWarning } from './types'

export type ChannelPhase = 'continuous' | 'dispersed' | 'emulsion'

/** Integer numbering of the compiled chip's nodes and a node → channels adjacency (CSR). */
export interface NodeTable {
  index: Map<string, number>
  from: Int32Array
  to: Int32Array
  count: number
  adjacencyStart: Int32Array
  adjacency: Int32Array
}

export function nodeTable(compiled: CompiledDocument): NodeTable {
  const index = new Map<string, number>()
  const number = (id: string) => {
    let i = index.get(id)
    if (i === undefined) index.set(id, (i = index.size))
    return i
  }
  const m = compiled.channels.length
  const from = new Int32Array(m)
  const to = new Int32Array(m)
  compiled.channels.forEach((ch, k) => ((from[k] = number(ch.from)), (to[k] = number(ch.to))))
  for (const s of compiled.sources) number(s.node)
  const count = index.size
  const adjacencyStart = new Int32Array(count + 1)
  for (let k = 0; k < m; k++) (adjacencyStart[from[k]! + 1]!++, adjacencyStart[to[k]! + 1]!++)
  for (let i = 0; i < count; i++) adjacencyStart[i + 1]! += adjacencyStart[i]!
  const fill = adjacencyStart.slice(0, count)
  const adjacency = new Int32Array(2 * m)
  for (let k = 0; k < m; k++) ((adjacency[fill[from[k]!]!++] = k), (adjacency[fill[to[k]!]!++] = k))
  return { index, from, to, count, adjacencyStart, adjacency }
}

export interface PhaseMap {
  phase: ChannelPhase[]
  /** Port id → the phase it feeds. */
  inletPhase: Map<string, 'continuous' | 'dispersed'>
  /** Node id of each junction's centre (where its dispersed arm ends), indexed like compiled.junctions. */
  centre: (string | undefined)[]
  nodes: NodeTable
  warnings: DocumentWarning[]
}

export function labelPhases(doc: ChipDocument, compiled: CompiledDocument): PhaseMap {
  const { channels, junctions, sources } = compiled
  const nodes = nodeTable(compiled)
  const centre = junctions.map(j => (j.dispersed >= 0 ? channels[j.dispersed]!.to : undefined))
  const stop = new Uint8Array(nodes.count)
  for (const c of centre) if (c !== undefined) stop[nodes.index.get(c)!] = 1
  for (const s of sources) stop[nodes.index.get(s.node)!] = 1
  const dispersedArm = new Uint8Array(channels.length)
  const continuousArm = new Uint8Array(channels.length)
  for (const j of junctions) {
    if (j.dispersed >= 0) dispersedArm[j.dispersed] = 1
    for (const k of j.continuous) if (k >= 0) continuousArm[k] = 1
  }
  const feeds = new Map(doc.ports.map(p => [p.id, p.feed?.phase]))

  const phase: (ChannelPhase | undefined)[] = new Array(channels.length).fill(undefined)
  const inletPhase = new Map<string, 'continuous' | 'dispersed'>()
  const warnings: DocumentWarning[] = []
  const mixed = new Set<number>()
  const marked = new Int32Array(channels.length).fill(-1)
  const seen = new Int32Array(nodes.count).fill(-1)
  sources.forEach((source, s) => {
    if (source.kind !== 'inlet') return
    const reached: number[] = []
    const start = nodes.index.get(source.node)!
    seen[start] = s
    const queue = [start]
    while (queue.length) {
      const node = queue.pop()!
      for (let e = nodes.adjacencyStart[node]!; e < nodes.adjacencyStart[node + 1]!; e++) {
        const k = nodes.adjacency[e]!
        if (marked[k] !== s) ((marked[k] = s), reached.push(k))
        const next = nodes.from[k] === node ? nodes.to[k]! : nodes.from[k]!
        if (seen[next] === s) continue
        seen[next] = s
        if (!stop[next]) queue.push(next)
      }
    }
    // The port says which phase it carries; without a feed, an inlet that reaches only dispersed arms is dispersed.
    const given = feeds.get(source.port)
    const inferred =
      reached.some(k => dispersedArm[k]) && !reached.some(k => continuousArm[k]) ? 'dispersed' : 'continuous'
    const liquid = given ?? inferred
    inletPhase.set(source.port, liquid)
    for (const k of reached) {
      if (phase[k] !== undefined && phase[k] !== liquid) mixed.add(k)
      phase[k] = liquid
    }
  })
  for (const k of mixed) {
    phase[k] = 'continuous'
    warnings.push({
      code: 'phases-meet',
      element: channels[k]!.element,
      message: `Both phases reach "${channels[k]!.id}" without passing a junction, so its liquid is uncertain; it is counted as the continuous phase — check the feeds of the inlets that reach it`,
    })
  }
  return { phase: phase.map(p => p ?? 'emulsion'), inletPhase, centre, nodes, warnings }
}
