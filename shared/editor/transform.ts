// Moving and turning a selection: components and ports carry a position, channels a polyline, marks a position.
// Turning is about a pivot, counter-clockwise in degrees (y up), as the document's own rotation.
import type { ChipDocument } from '../schemas/chip'
import { reattach } from './attach'
import type { ActionOutcome, PointUm } from './types'

type Map2 = (p: PointUm) => PointUm

function mapSelection(doc: ChipDocument, ids: ReadonlySet<string>, f: Map2, turnDeg = 0): ChipDocument {
  const next: ChipDocument = {
    ...doc,
    components: doc.components.map(c =>
      ids.has(c.id) ? { ...c, position: f(c.position), rotation: normalise(c.rotation + turnDeg) } : c,
    ),
    ports: doc.ports.map(p => (ids.has(p.id) ? { ...p, position: f(p.position) } : p)),
    channels: doc.channels.map(ch => (ids.has(ch.id) ? { ...ch, points: ch.points.map(f) } : ch)),
    marks: doc.marks.map(m => (ids.has(m.id) ? { ...m, position: f(m.position) } : m)),
  }
  return reattach(next, ids)
}

const normalise = (deg: number): number => ((deg % 360) + 360) % 360
const round = (v: number): number => Math.round(v * 1e6) / 1e6

/** Translate every selected element by (dx, dy) µm. `preview: true` keeps it out of the undo history. */
export function move(
  doc: ChipDocument,
  args: { ids: string[]; dx: number; dy: number; preview?: boolean },
): ActionOutcome {
  const ids = new Set(args.ids)
  return {
    doc: mapSelection(doc, ids, p => ({ x: round(p.x + args.dx), y: round(p.y + args.dy) })),
    history: args.preview ? 'skip' : 'record',
  }
}

/** The pivot of a selection: a lone component or port turns about its own position, else about the centre of the positions. */
export function pivotOf(doc: ChipDocument, ids: string[]): PointUm {
  const pts: PointUm[] = []
  for (const c of doc.components) if (ids.includes(c.id)) pts.push(c.position)
  for (const p of doc.ports) if (ids.includes(p.id)) pts.push(p.position)
  for (const m of doc.marks) if (ids.includes(m.id)) pts.push(m.position)
  for (const ch of doc.channels) if (ids.includes(ch.id)) pts.push(...ch.points)
  if (pts.length === 0) return { x: 0, y: 0 }
  const xs = pts.map(p => p.x)
  const ys = pts.map(p => p.y)
  return { x: (Math.min(...xs) + Math.max(...xs)) / 2, y: (Math.min(...ys) + Math.max(...ys)) / 2 }
}

/** Turn the selection by `deg` (counter-clockwise) about its pivot; a component also turns its own frame. */
export function rotate(doc: ChipDocument, args: { ids: string[]; deg: number; pivot?: PointUm }): ActionOutcome {
  const pivot = args.pivot ?? pivotOf(doc, args.ids)
  const a = (args.deg * Math.PI) / 180
  const c = Math.cos(a)
  const s = Math.sin(a)
  const f: Map2 = p => {
    const x = p.x - pivot.x
    const y = p.y - pivot.y
    return { x: round(pivot.x + c * x - s * y), y: round(pivot.y + s * x + c * y) }
  }
  return { doc: mapSelection(doc, new Set(args.ids), f, args.deg), history: 'record' }
}
