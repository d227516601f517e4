// An array of droplet makers from the geometry generator: N step nozzles or T-junctions on a manifold sized for
// even flow (geometry/arrays). It either becomes the whole document or is added beside what is already drawn,
// with fresh ids, its layers matched to existing ones of the same depth, and its inlets on the active operating point.
import { generateParallelChip, generateTJunctionChip } from '../../geometry/arrays'
import type { ChipDocument, Outline } from '../schemas/chip'
import { freshId, usedIds } from './elements'
import { move } from './transform'
import type { ActionOutcome } from './types'

export type ArrayKind = 'step-nozzle' | 't-junction'

export interface ArrayArgs {
  kind: ArrayKind
  /** How many nozzles or junctions, a whole number ≥ 1. */
  count: number
  /** Centre-to-centre spacing, µm. */
  pitch: number
  /** 'replace' makes the array the whole chip (the design name stays); 'add' puts it to the right of the chip. */
  mode: 'replace' | 'add'
  created?: string[]
}

/** Largest array the editor builds in one step (the generator itself goes further; the canvas stays responsive here). */
export const ARRAY_LIMIT = 1024
/** Space left between the chip and an added array, µm (round value, not from a source). */
const GAP = 2000

export function generateArray(kind: ArrayKind, count: number, pitch: number): ChipDocument {
  if (!Number.isInteger(count) || count < 1 || count > ARRAY_LIMIT)
    throw new Error(`Array count must be a whole number from 1 to ${ARRAY_LIMIT} (got ${count})`)
  if (!(pitch > 0)) throw new Error(`Array pitch must be > 0 µm (got ${pitch})`)
  return kind === 'step-nozzle'
    ? generateParallelChip({ nozzles: count, pitch })
    : generateTJunctionChip({ junctions: count, pitch })
}

export function placeArray(doc: ChipDocument, args: ArrayArgs): ActionOutcome {
  const gen = generateArray(args.kind, args.count, args.pitch)
  if (args.mode === 'replace') {
    args.created?.push(...gen.components.map(c => c.id))
    return { doc: { ...gen, name: doc.name }, history: 'record' }
  }
  const used = usedIds(doc)
  const layerMap = new Map<string, string>()
  const layers = [...doc.layers]
  for (const l of gen.layers) {
    const same = doc.layers.find(x => x.depth === l.depth)
    if (same) layerMap.set(l.id, same.id)
    else {
      const id = freshId(used, l.id)
      layerMap.set(l.id, id)
      layers.push({ ...l, id })
    }
  }
  const ids = new Map<string, string>()
  for (const e of [...gen.components, ...gen.ports, ...gen.channels, ...gen.marks]) ids.set(e.id, freshId(used, e.id))
  const L = (id: string) => layerMap.get(id) ?? id
  const E = (id: string) => ids.get(id) ?? id
  const components = gen.components.map(c => {
    const r: Record<string, unknown> = { ...c, id: E(c.id), layerId: L(c.layerId) }
    for (const k of ['reservoirLayerId', 'supplyLayerId']) if (typeof r[k] === 'string') r[k] = L(r[k] as string)
    return r as typeof c
  })
  const ports = gen.ports.map(p => ({ ...p, id: E(p.id), layerId: L(p.layerId) }))
  const channels = gen.channels.map(ch => ({
    ...ch,
    id: E(ch.id),
    layerId: L(ch.layerId),
    ...(ch.start ? { start: { ...ch.start, element: E(ch.start.element) } } : {}),
    ...(ch.end ? { end: { ...ch.end, element: E(ch.end.element) } } : {}),
  }))
  const marks = gen.marks.map(m => ({ ...m, id: E(m.id), layerIds: m.layerIds.map(L) }))
  const inlets = (gen.operatingPoints.find(o => o.id === gen.activeOperatingPoint)?.inlets ?? []).map(i => ({
    ...i,
    portId: E(i.portId),
  }))
  const opId = doc.activeOperatingPoint
  const operatingPoints =
    opId && doc.operatingPoints.some(o => o.id === opId)
      ? doc.operatingPoints.map(o => (o.id === opId ? { ...o, inlets: [...o.inlets, ...inlets] } : o))
      : gen.operatingPoints.map(o => ({ ...o, inlets: o.inlets.map(i => ({ ...i, portId: E(i.portId) })) }))
  const merged: ChipDocument = {
    ...doc,
    layers,
    components: [...doc.components, ...components],
    ports: [...doc.ports, ...ports],
    channels: [...doc.channels, ...channels],
    marks: [...doc.marks, ...marks],
    operatingPoints,
    activeOperatingPoint: doc.activeOperatingPoint ?? gen.activeOperatingPoint,
  }
  const here = bounds(doc)
  const there = bounds(gen)
  const dx = here && there ? here.maxX + GAP - there.minX : 0
  const dy = here && there ? here.minY - there.minY : 0
  const added = [...ids.values()]
  args.created?.push(...components.map(c => c.id))
  const moved = move(merged, { ids: added, dx, dy }).doc
  const outline =
    here && there
      ? rect(
          Math.min(here.minX, there.minX + dx),
          Math.min(here.minY, there.minY + dy),
          Math.max(here.maxX, there.maxX + dx),
          Math.max(here.maxY, there.maxY + dy),
        )
      : gen.outline
  return { doc: { ...moved, ...(outline ? { outline } : {}) }, history: 'record' }
}

const rect = (x0: number, y0: number, x1: number, y1: number): Outline => ({
  kind: 'rectangle',
  corner: { x: x0, y: y0 },
  width: x1 - x0,
  height: y1 - y0,
})

/** The extent of a chip: its outline, else the positions of everything on it (µm); null for an empty chip. */
export function bounds(doc: ChipDocument): { minX: number; minY: number; maxX: number; maxY: number } | null {
  const o = doc.outline
  const pts =
    o?.kind === 'rectangle'
      ? [o.corner, { x: o.corner.x + o.width, y: o.corner.y + o.height }]
      : o?.kind === 'polygon'
        ? o.points
        : [
            ...doc.components.map(c => c.position),
            ...doc.ports.map(p => p.position),
            ...doc.marks.map(m => m.position),
            ...doc.channels.flatMap(c => c.points),
          ]
  if (pts.length === 0) return null
  const xs = pts.map(p => p.x)
  const ys = pts.map(p => p.y)
  return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) }
}
