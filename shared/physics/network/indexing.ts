// Checks a network and numbers its nodes: unknown pressures get indices 0..m−1, fixed ones are set aside.
import { NetworkError } from '../errors'
import type { NetworkProblem } from './types'

export interface IndexedNetwork {
  nodeIds: string[]
  /** Node id → its index in `nodeIds` (the map the numbering built; kept so results need not rebuild it). */
  nodeIndex: Map<string, number>
  /** Per channel: node indices and conductance 1/R. */
  from: Int32Array
  to: Int32Array
  conductance: Float64Array
  /** Per channel: pressure offset (Pa), 0 for plain channels. */
  offset: Float64Array
  /** Per node: fixed pressure or NaN when unknown; injected flow. */
  fixedPressure: Float64Array
  injected: Float64Array
  /** Per node: index in the unknown vector, −1 for fixed nodes. */
  unknownIndex: Int32Array
  unknownCount: number
}

/** Numbers the nodes in order of first appearance and fills each channel's end indices (one map lookup per end). */
function nodeIndex(problem: NetworkProblem, from: Int32Array, to: Int32Array): Map<string, number> {
  const index = new Map<string, number>()
  const channels = problem.channels
  for (let k = 0; k < channels.length; k++) {
    const channel = channels[k]!
    if (!(channel.resistance > 0) || !Number.isFinite(channel.resistance)) {
      throw new NetworkError(
        'bad-resistance',
        `Channel "${channel.id}" has resistance ${channel.resistance}; it must be finite and > 0 — check its width, depth and length`,
        { channelIndex: k },
      )
    }
    if (channel.from === channel.to) {
      throw new NetworkError(
        'self-loop',
        `Channel "${channel.id}" starts and ends at node "${channel.from}"; connect it to two different nodes`,
        { channelIndex: k },
      )
    }
    let a = index.get(channel.from)
    if (a === undefined) index.set(channel.from, (a = index.size))
    let b = index.get(channel.to)
    if (b === undefined) index.set(channel.to, (b = index.size))
    from[k] = a
    to[k] = b
  }
  return index
}

export function indexNetwork(problem: NetworkProblem): IndexedNetwork {
  const m = problem.channels.length
  const from = new Int32Array(m)
  const to = new Int32Array(m)
  const index = nodeIndex(problem, from, to)
  const n = index.size
  const fixedPressure = new Float64Array(n).fill(Number.NaN)
  const injected = new Float64Array(n)
  const hasFlow = new Uint8Array(n)
  problem.sources.forEach((source, k) => {
    const i = index.get(source.node)
    if (i === undefined) {
      throw new NetworkError(
        'unknown-node',
        `Source ${k} refers to node "${source.node}", which no channel touches; use a node id from the channels`,
        { sourceIndex: k, nodes: [source.node] },
      )
    }
    if ('pressure' in source) {
      if (!Number.isNaN(fixedPressure[i]!) || hasFlow[i]) {
        throw new NetworkError(
          'over-constrained',
          `Node "${source.node}" already has a source; give each node at most one pressure source and no flow source next to it`,
          { sourceIndex: k, nodes: [source.node] },
        )
      }
      fixedPressure[i] = source.pressure
    } else {
      if (!Number.isNaN(fixedPressure[i]!)) {
        throw new NetworkError(
          'over-constrained',
          `Node "${source.node}" has a fixed pressure and a flow source; remove one of them`,
          { sourceIndex: k, nodes: [source.node] },
        )
      }
      hasFlow[i] = 1
      injected[i] = injected[i]! + source.flow
    }
  })
  const conductance = new Float64Array(m)
  const offset = new Float64Array(m)
  problem.channels.forEach((channel, k) => {
    conductance[k] = 1 / channel.resistance
    if (channel.offset !== undefined) {
      if (!Number.isFinite(channel.offset))
        throw new NetworkError(
          'bad-resistance',
          `Channel "${channel.id}" has pressure offset ${channel.offset}; it must be finite`,
          { channelIndex: k },
        )
      offset[k] = channel.offset
    }
  })
  const nodeIds = [...index.keys()]
  assertGrounded(nodeIds, from, to, fixedPressure)
  const unknownIndex = new Int32Array(n)
  let unknownCount = 0
  for (let i = 0; i < n; i++) unknownIndex[i] = Number.isNaN(fixedPressure[i]!) ? unknownCount++ : -1
  return {
    nodeIds,
    nodeIndex: index,
    from,
    to,
    conductance,
    offset,
    fixedPressure,
    injected,
    unknownIndex,
    unknownCount,
  }
}

/** Every node must reach a fixed-pressure node through channels, or its pressure is undetermined. */
function assertGrounded(nodeIds: string[], from: Int32Array, to: Int32Array, fixedPressure: Float64Array): void {
  const n = nodeIds.length
  const degree = new Int32Array(n + 1)
  for (let k = 0; k < from.length; k++) {
    degree[from[k]! + 1]!++
    degree[to[k]! + 1]!++
  }
  for (let i = 0; i < n; i++) degree[i + 1]! += degree[i]!
  const fill = degree.slice(0, n)
  const neighbours = new Int32Array(2 * from.length)
  for (let k = 0; k < from.length; k++) {
    neighbours[fill[from[k]!]!++] = to[k]!
    neighbours[fill[to[k]!]!++] = from[k]!
  }
  const seen = new Uint8Array(n)
  const queue = new Int32Array(n)
  let head = 0
  let tail = 0
  for (let i = 0; i < n; i++) if (!Number.isNaN(fixedPressure[i]!)) ((seen[i] = 1), (queue[tail++] = i))
  while (head < tail) {
    const i = queue[head++]!
    for (let e = degree[i]!; e < degree[i + 1]!; e++) {
      const j = neighbours[e]!
      if (!seen[j]) ((seen[j] = 1), (queue[tail++] = j))
    }
  }
  if (tail === n) return
  const floating = nodeIds.filter((_, i) => !seen[i])
  const shown = floating
    .slice(0, 10)
    .map(id => `"${id}"`)
    .join(', ')
  const more = floating.length > 10 ? ` and ${floating.length - 10} more` : ''
  throw new NetworkError(
    'floating',
    `Nodes ${shown}${more} are not connected to any pressure source, so their pressure is undetermined; connect them to an outlet or add a pressure source (e.g. an outlet at 0 Pa)`,
    { nodes: floating },
  )
}
