// Drawing new things: a channel from clicked points, a part or a port placed (bends: channelPoints.ts).
import type { ChipDocument, InletSetting, TerminalRef } from '../schemas/chip'
import { freshId, usedIds } from './elements'
import { componentTemplate, deeperLayer, type PlaceableKind } from './templates'
import type { ActionOutcome, PointUm } from './types'

export interface NewChannel {
  points: PointUm[]
  width: number
  layerId: string
  start?: TerminalRef
  end?: TerminalRef
  created?: string[]
}

export function addChannel(doc: ChipDocument, args: NewChannel): ActionOutcome {
  const id = freshId(usedIds(doc), 'channel')
  args.created?.push(id)
  const channel = {
    id,
    layerId: args.layerId,
    width: args.width,
    points: args.points.map(p => ({ x: p.x, y: p.y })),
    ...(args.start ? { start: args.start } : {}),
    ...(args.end ? { end: args.end } : {}),
  }
  return { doc: { ...doc, channels: [...doc.channels, channel] }, history: 'record' }
}

/** Place a part from the palette. A step nozzle's reservoir goes on a deeper layer, added when there is none. */
export function placeComponent(
  doc: ChipDocument,
  args: { kind: PlaceableKind; position: PointUm; layerId: string; created?: string[] },
): ActionOutcome {
  const used = usedIds(doc)
  const id = freshId(
    used,
    args.kind === 't-junction'
      ? 'tj'
      : args.kind === 'flow-focusing'
        ? 'ff'
        : args.kind === 'y-junction'
          ? 'yj'
          : args.kind === 'step-nozzle'
            ? 'step'
            : 'serp',
  )
  let layers = doc.layers
  let reservoir: string | undefined
  if (args.kind === 'step-nozzle') {
    reservoir = deeperLayer(doc, args.layerId) ?? undefined
    if (!reservoir) {
      const own = doc.layers.find(l => l.id === args.layerId)
      reservoir = freshId(used, 'reservoir')
      layers = [...layers, { id: reservoir, name: 'Reservoir', depth: Math.max(3 * (own?.depth ?? 50), 100) }]
    }
  }
  args.created?.push(id)
  const component = componentTemplate(
    args.kind,
    id,
    { x: args.position.x, y: args.position.y },
    args.layerId,
    reservoir,
  )
  return { doc: { ...doc, layers, components: [...doc.components, component] }, history: 'record' }
}

/**
 * Place a port. An inlet carries a phase; the active operating point gets a flow setting for it (10 µL/min
 * continuous, 2 µL/min dispersed — round starting values, not from a source) so the forecast can run at once.
 */
export function placePort(
  doc: ChipDocument,
  args: {
    kind: 'inlet' | 'outlet'
    phase?: 'continuous' | 'dispersed'
    position: PointUm
    layerId: string
    punchDiameter?: number
    created?: string[]
  },
): ActionOutcome {
  const id = freshId(
    usedIds(doc),
    args.kind === 'outlet' ? 'out' : args.phase === 'dispersed' ? 'dispersed-in' : 'continuous-in',
  )
  args.created?.push(id)
  const phase = args.kind === 'inlet' ? (args.phase ?? 'continuous') : undefined
  const port = {
    id,
    kind: args.kind,
    position: { x: args.position.x, y: args.position.y },
    punchDiameter: args.punchDiameter ?? 750,
    layerId: args.layerId,
    ...(phase ? { feed: { phase } } : {}),
  }
  const opId = doc.activeOperatingPoint
  const setting: InletSetting | null = phase
    ? { portId: id, mode: 'flow', value: phase === 'dispersed' ? 2 : 10, unit: 'uL/min' }
    : null
  const operatingPoints =
    setting && opId
      ? doc.operatingPoints.map(o => (o.id === opId ? { ...o, inlets: [...o.inlets, setting] } : o))
      : doc.operatingPoints
  return { doc: { ...doc, ports: [...doc.ports, port], operatingPoints }, history: 'record' }
}
