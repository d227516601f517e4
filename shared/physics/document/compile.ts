// A chip document at one operating point → straight channels between named nodes, junctions and sources.
// Channels: layer depth, drawn centre-line length, width. Ends: an explicit terminal reference, else a free end
// joined to whatever free end or terminal lies within COINCIDENCE_UM. Terminals do not join each other
// directly: components connect through channels. Components: see components.ts. Inlets per the operating
// point, outlets at 0 Pa gauge.
import type { ChipDocument } from '../../schemas/chip'
import { componentTerminals, terminalNames } from '../../schemas/chip'
import { ForecastInputError, type InputIssue } from '../errors'
import { compileComponent } from './components'
import { Connections, terminalKey } from './connect'
import { inletInSi, type ResolvedOperatingPoint } from './operating-point'
import { documentPath } from './paths'
import type { CompiledChannel, CompiledDocument, CompiledJunction, DocumentSource, DocumentWarning } from './types'

const UM = 1e-6

function polylineLength(points: readonly { x: number; y: number }[]): number {
  let length = 0
  for (let i = 1; i < points.length; i++)
    length += Math.hypot(points[i]!.x - points[i - 1]!.x, points[i]!.y - points[i - 1]!.y)
  return length
}

export function compileDocument(doc: ChipDocument, op: ResolvedOperatingPoint): CompiledDocument {
  const depthUm = new Map(doc.layers.map(layer => [layer.id, layer.depth]))
  const depth = (layerId: string) => depthUm.get(layerId)!
  const ports = new Set(doc.ports.map(p => p.id))
  const connections = new Connections()
  const endKey = (channelId: string, ref: { element: string; terminal: string } | undefined, end: 'start' | 'end') =>
    ref ? terminalKey(ref.element, ref.terminal, ports.has(ref.element)) : `${channelId}:${end}`
  let freeEnds = 0
  doc.channels.forEach(ch => {
    if (!ch.start) (connections.add(`${ch.id}:start`, ch.points[0]!, 2), freeEnds++)
    if (!ch.end) (connections.add(`${ch.id}:end`, ch.points[ch.points.length - 1]!, 2), freeEnds++)
  })
  // Terminals join only through channels, so their positions matter only when some channel end is free.
  const positions = freeEnds > 0
  for (const p of doc.ports) connections.add(p.id, p.position, 0)
  for (const c of doc.components) {
    if (positions)
      for (const t of componentTerminals(c)) connections.add(terminalKey(c.id, t.name, false), t.position, 1)
    else for (const name of terminalNames(c)) connections.add(terminalKey(c.id, name, false), c.position, 1)
  }
  if (positions) connections.joinCoincident(2)
  else connections.keepApart()

  const channels: CompiledChannel[] = []
  const junctions: CompiledJunction[] = []
  const warnings: DocumentWarning[] = []
  const issues: InputIssue[] = []
  doc.channels.forEach((ch, i) => {
    const length = polylineLength(ch.points)
    if (!(length > 0)) {
      issues.push({
        path: documentPath(['channels', i, 'points']),
        message: `Channel "${ch.id}" has zero length (all its points coincide): move its end or delete it`,
      })
      return
    }
    channels.push({
      id: ch.id,
      element: ch.id,
      from: connections.node(endKey(ch.id, ch.start, 'start')),
      to: connections.node(endKey(ch.id, ch.end, 'end')),
      width: ch.width * UM,
      depth: depth(ch.layerId) * UM,
      length: length * UM,
    })
  })
  if (issues.length) throw new ForecastInputError(issues)
  // A component no channel reaches (just placed, not yet wired) cannot carry flow: leave it out and say so, as
  // for an unconnected outlet, rather than fail the whole chip's forecast.
  const reached = new Set<string>()
  for (const ch of channels) (reached.add(ch.from), reached.add(ch.to))
  for (const c of doc.components) {
    if (!terminalNames(c).some(name => reached.has(connections.node(terminalKey(c.id, name, false))))) {
      warnings.push({
        code: 'component-unconnected',
        element: c.id,
        message: `Component "${c.id}" is not connected to any channel, so it is not forecast: end a channel on one of its terminals (${terminalNames(c).join(', ')})`,
      })
      continue
    }
    compileComponent(c, {
      terminal: name => connections.node(terminalKey(c.id, name, false)),
      depth,
      channels,
      junctions,
    })
  }

  // A channel whose two ends are one node carries no flow (a closed loop drawn onto itself): drop it, say so.
  const kept = channels.filter(ch => {
    if (ch.from !== ch.to) return true
    warnings.push({
      code: 'channel-loop',
      element: ch.element,
      message: `Channel "${ch.id}" starts and ends at the same node "${ch.from}", so it carries no flow; attach one of its ends elsewhere`,
    })
    return false
  })
  if (kept.length !== channels.length) remapJunctions(junctions, channels, kept)

  const used = new Set<string>()
  for (const ch of kept) (used.add(ch.from), used.add(ch.to))
  const sources: DocumentSource[] = []
  const settings = new Map(op.point.inlets.map(s => [s.portId, s]))
  const inletsPath = documentPath(['operatingPoints', op.index, 'inlets'])
  doc.ports.forEach((p, i) => {
    const node = connections.node(p.id)
    if (!used.has(node)) {
      if (p.kind === 'inlet')
        issues.push({
          path: documentPath(['ports', i]),
          message: `Inlet port "${p.id}" is not connected to any channel: end a channel on it ({ "element": "${p.id}", "terminal": "port" }) or delete the port`,
        })
      else
        warnings.push({
          code: 'port-unconnected',
          element: p.id,
          message: `Outlet port "${p.id}" is not connected to any channel; it is left out of the network`,
        })
      return
    }
    if (p.kind === 'outlet') {
      sources.push({ port: p.id, kind: 'outlet', node, mode: 'pressure', pressure: 0 })
      return
    }
    const setting = settings.get(p.id)
    if (!setting) {
      const example = `{ "portId": "${p.id}", "mode": "flow", "value": 5, "unit": "uL/min" }`
      issues.push({
        path: inletsPath,
        message: `Inlet port "${p.id}" has no feed in operating point "${op.point.id}": add ${example} (or mode "pressure" with "mbar")`,
      })
      return
    }
    const si = inletInSi(setting)
    sources.push(
      'pressure' in si
        ? { port: p.id, kind: 'inlet', node, mode: 'pressure', pressure: si.pressure }
        : { port: p.id, kind: 'inlet', node, mode: 'flow', flow: si.flow },
    )
  })
  if (issues.length) throw new ForecastInputError(issues)
  const wired = dropIslands(kept, sources, warnings)
  if (wired.length !== kept.length) remapJunctions(junctions, kept, wired)
  return { channels: wired, junctions, sources, warnings }
}

/**
 * A group of channels that touches no inlet and no outlet (a channel just drawn, not yet wired) carries no flow
 * and has no pressure to solve for: leave it out with a warning naming its elements, as for an unwired part,
 * rather than fail the whole chip. A group that has a feed but no way out still fails the solve, as it should.
 */
function dropIslands(
  channels: CompiledChannel[],
  sources: DocumentSource[],
  warnings: DocumentWarning[],
): CompiledChannel[] {
  const parent = new Map<string, string>()
  // Union–find with full path compression (Tarjan 1975), so a long manifold stays near-linear.
  const root = (n: string): string => {
    let r = n
    while (parent.has(r) && parent.get(r) !== r) r = parent.get(r)!
    for (let x = n; x !== r;) {
      const next = parent.get(x)!
      parent.set(x, r)
      x = next
    }
    return r
  }
  for (const ch of channels) {
    const a = root(ch.from),
      b = root(ch.to)
    if (a !== b) parent.set(a, b)
  }
  const fed = new Set(sources.map(s => root(s.node)))
  const left: string[] = []
  const kept = channels.filter(ch => {
    if (fed.has(root(ch.from))) return true
    if (!left.includes(ch.element)) left.push(ch.element)
    return false
  })
  for (const element of left) {
    warnings.push({
      code: 'channels-unconnected',
      element,
      message: `"${element}" is not connected to any inlet or outlet, so it carries no flow and is not forecast: connect it to the chip or delete it`,
    })
  }
  return kept
}

/** Junctions refer to channels by index; re-point them after channels were dropped. */
function remapJunctions(junctions: CompiledJunction[], before: CompiledChannel[], after: CompiledChannel[]): void {
  const position = new Map(after.map((ch, k) => [ch, k]))
  const to = (k: number) => position.get(before[k]!) ?? -1
  for (const j of junctions) {
    j.dispersed = to(j.dispersed)
    j.continuous = j.continuous.map(to)
  }
}
