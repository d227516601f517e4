// Reshaping a drawn channel: insert a bend where the person clicks, drag a bend or an end, remove a bend.
// An end attached to a terminal lets go when it is dragged away and attaches to the terminal it is dropped on.
import type { ChipDocument, TerminalRef } from '../schemas/chip'
import type { ActionOutcome, PointUm } from './types'

type Channel = ChipDocument['channels'][number]

function withChannel(doc: ChipDocument, id: string, f: (c: Channel) => Channel): ChipDocument {
  const ch = doc.channels.find(c => c.id === id)
  if (!ch) throw new Error(`No channel "${id}" in this design (it may have been deleted)`)
  return { ...doc, channels: doc.channels.map(c => (c === ch ? f(c) : c)) }
}

/** Squared distance (µm²) from p to the segment a–b. */
function segmentDistance2(p: PointUm, a: PointUm, b: PointUm): number {
  const dx = b.x - a.x,
    dy = b.y - a.y
  const len2 = dx * dx + dy * dy
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2))
  const x = a.x + t * dx - p.x,
    y = a.y + t * dy - p.y
  return x * x + y * y
}

/** Index of the segment of a polyline nearest to p (segment i runs from point i to point i + 1). */
export function nearestSegment(points: PointUm[], p: PointUm): number {
  let best = 0,
    bestD = Infinity
  for (let i = 0; i + 1 < points.length; i++) {
    const d = segmentDistance2(p, points[i]!, points[i + 1]!)
    if (d < bestD) {
      bestD = d
      best = i
    }
  }
  return best
}

/** Insert a bend at `point`: before point `index` when given (points.length appends), else into the segment nearest to it. */
export function insertChannelPoint(
  doc: ChipDocument,
  args: { id: string; point: PointUm; index?: number; inserted?: number[] },
): ActionOutcome {
  return {
    doc: withChannel(doc, args.id, c => {
      const i =
        args.index !== undefined
          ? Math.max(0, Math.min(c.points.length, args.index))
          : nearestSegment(c.points, args.point) + 1
      args.inserted?.push(i)
      return { ...c, points: [...c.points.slice(0, i), { x: args.point.x, y: args.point.y }, ...c.points.slice(i)] }
    }),
    history: 'record',
  }
}

/** Move point `index` of a channel. Moving an end lets go of its terminal, or attaches it to `attach` when given. */
export function moveChannelPoint(
  doc: ChipDocument,
  args: { id: string; index: number; point: PointUm; attach?: TerminalRef },
): ActionOutcome {
  return {
    doc: withChannel(doc, args.id, c => {
      if (!(args.index >= 0 && args.index < c.points.length))
        throw new Error(`Channel "${c.id}" has no point ${args.index + 1} (it has ${c.points.length})`)
      const points = c.points.map((p, i) => (i === args.index ? { x: args.point.x, y: args.point.y } : p))
      const next: Channel = { ...c, points }
      const end = args.index === 0 ? 'start' : args.index === c.points.length - 1 ? 'end' : null
      if (end) {
        delete next[end]
        if (args.attach) next[end] = { ...args.attach }
      }
      return next
    }),
    history: 'record',
  }
}

/** Remove point `index`; a channel keeps at least two points, and removing an end lets go of its terminal. */
export function removeChannelPoint(doc: ChipDocument, args: { id: string; index: number }): ActionOutcome {
  return {
    doc: withChannel(doc, args.id, c => {
      if (c.points.length <= 2)
        throw new Error(`Channel "${c.id}" needs at least two points: delete the channel instead`)
      if (!(args.index >= 0 && args.index < c.points.length))
        throw new Error(`Channel "${c.id}" has no point ${args.index + 1} (it has ${c.points.length})`)
      const next: Channel = { ...c, points: c.points.filter((_, i) => i !== args.index) }
      if (args.index === 0) delete next.start
      if (args.index === c.points.length - 1) delete next.end
      return next
    }),
    history: 'record',
  }
}
