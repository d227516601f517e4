// Linear solves of the compiled chip at given resistances, entry-barrier offsets and closed channels, with the
// solver's errors mapped onto the document's elements.
import type { ChipDocument } from '../../schemas/chip'
import { ForecastInputError, NetworkError } from '../errors'
import { NetworkResolver, type NetworkChannel, type NetworkSolution } from '../network'
import { documentPath } from './paths'
import type { CompiledDocument } from './types'

const ELEMENT_LIST_MAX = 10

/** Names the elements a set of nodes belongs to: `channel "a", t-junction "tj-2"`. */
function describeElements(
  doc: ChipDocument,
  compiled: CompiledDocument,
  nodes: readonly string[],
): { text: string; path: string } {
  const floating = new Set(nodes)
  const elements: string[] = []
  for (const ch of compiled.channels)
    if ((floating.has(ch.from) || floating.has(ch.to)) && !elements.includes(ch.element)) elements.push(ch.element)
  const label = (id: string) => {
    const channel = doc.channels.findIndex(c => c.id === id)
    if (channel >= 0) return { text: `channel "${id}"`, path: documentPath(['channels', channel]) }
    const component = doc.components.findIndex(c => c.id === id)
    if (component >= 0)
      return { text: `${doc.components[component]!.kind} "${id}"`, path: documentPath(['components', component]) }
    const port = doc.ports.findIndex(p => p.id === id)
    return { text: `port "${id}"`, path: documentPath(['ports', Math.max(port, 0)]) }
  }
  const labels = elements.map(label)
  const more = labels.length > ELEMENT_LIST_MAX ? ` and ${labels.length - ELEMENT_LIST_MAX} more` : ''
  return {
    text:
      labels
        .slice(0, ELEMENT_LIST_MAX)
        .map(l => l.text)
        .join(', ') + more,
    path: labels[0]?.path ?? 'document',
  }
}

/** Maps a solver error onto the document's elements; `kept` maps the solve's channel indices to the compiled ones. */
function explain(doc: ChipDocument, compiled: CompiledDocument, error: unknown, kept: readonly number[]): never {
  if (!(error instanceof NetworkError)) throw error
  if (error.code === 'floating') {
    const { text, path } = describeElements(doc, compiled, error.detail.nodes ?? [])
    throw new ForecastInputError([
      {
        path,
        message: `Not connected to any outlet or pressure-driven inlet, so the pressure there is undetermined: ${text}. Connect these elements to the rest of the chip or delete them`,
      },
    ])
  }
  if (error.code === 'over-constrained') {
    const ports = compiled.sources
      .filter(s => error.detail.nodes?.includes(s.node))
      .map(s => `"${s.port}"`)
      .join(' and ')
    throw new ForecastInputError([
      {
        path: 'document.ports',
        message: `Ports ${ports} sit on one node (they touch or coincide), so it gets two settings: move them apart or delete one`,
      },
    ])
  }
  const index = error.detail.channelIndex !== undefined ? kept[error.detail.channelIndex] : undefined
  const where = index !== undefined ? compiled.channels[index] : undefined
  throw new ForecastInputError([
    { path: 'document', message: where ? `${error.message} (element "${where.element}")` : error.message },
  ])
}

/**
 * Solves the compiled chip again and again at new resistances, entry-barrier offsets and inlet settings;
 * channels in `closed` (stalled dispersed arms) are left out, flow 0. One indexed network per closed set.
 */
export class DocumentSolver {
  private readonly resolvers = new Map<string, { resolver: NetworkResolver; kept: number[] }>()

  constructor(
    private readonly doc: ChipDocument,
    private readonly compiled: CompiledDocument,
  ) {}

  solve(
    resistance: Float64Array,
    offset: Float64Array,
    closed: ReadonlySet<number>,
    sources: CompiledDocument['sources'] = this.compiled.sources,
  ): NetworkSolution {
    const key = [...closed].sort((a, b) => a - b).join(',')
    let entry = this.resolvers.get(key)
    const { compiled } = this
    const networkSources = sources.map(s =>
      s.mode === 'pressure' ? { node: s.node, pressure: s.pressure } : { node: s.node, flow: s.flow },
    )
    if (!entry) {
      const kept: number[] = []
      const channels: NetworkChannel[] = []
      compiled.channels.forEach((ch, k) => {
        if (closed.has(k)) return
        kept.push(k)
        channels.push({ id: ch.id, from: ch.from, to: ch.to, resistance: 1 })
      })
      try {
        entry = { resolver: new NetworkResolver({ channels, sources: networkSources }), kept }
      } catch (error) {
        explain(this.doc, compiled, error, kept)
      }
      this.resolvers.set(key, entry)
    }
    const { resolver, kept } = entry
    const all = kept.length === compiled.channels.length
    const r = all ? resistance : new Float64Array(kept.length)
    const o = all ? offset : new Float64Array(kept.length)
    if (!all) kept.forEach((k, i) => ((r[i] = resistance[k]!), (o[i] = offset[k]!)))
    let solution: NetworkSolution
    try {
      solution = resolver.solve(r, o, networkSources)
    } catch (error) {
      explain(this.doc, compiled, error, kept)
    }
    if (kept.length === compiled.channels.length) return solution
    const flow = new Float64Array(compiled.channels.length)
    kept.forEach((k, i) => (flow[k] = solution.flow[i]!))
    return { ...solution, flow }
  }
}
