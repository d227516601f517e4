// Snapping a pointer position (µm): to a terminal when one is near, else to the grid.
import { componentTerminals, portTerminals, type ChipDocument, type TerminalRef } from '../schemas/chip'
import type { PointUm } from './types'

/** Nearest grid point at `pitch` µm; a pitch of 0 or less means no grid. */
export function snapToGrid(p: PointUm, pitch: number): PointUm {
  if (!(pitch > 0)) return { x: p.x, y: p.y }
  const r = (v: number) => Math.round(v / pitch) * pitch
  return { x: r(p.x), y: r(p.y) }
}

/** Snap a move so the dragged reference point lands on the grid: returns the snapped delta. */
export function snapDelta(origin: PointUm, dx: number, dy: number, pitch: number): PointUm {
  const to = snapToGrid({ x: origin.x + dx, y: origin.y + dy }, pitch)
  return { x: to.x - origin.x, y: to.y - origin.y }
}

export interface TerminalHit {
  ref: TerminalRef
  position: PointUm
  width: number
  layerId: string
  distance: number
}

/** The terminal nearest to `p` within `radius` µm (component ends and ports), or null. */
export function nearestTerminal(
  doc: ChipDocument,
  p: PointUm,
  radius: number,
  exclude: ReadonlySet<string> = new Set(),
): TerminalHit | null {
  let best: TerminalHit | null = null
  const consider = (element: string, ts: ReturnType<typeof portTerminals>) => {
    if (exclude.has(element)) return
    for (const t of ts) {
      const d = Math.hypot(t.position.x - p.x, t.position.y - p.y)
      if (d <= radius && (!best || d < best.distance))
        best = {
          ref: { element, terminal: t.name },
          position: t.position,
          width: t.width,
          layerId: t.layerId,
          distance: d,
        }
    }
  }
  for (const c of doc.components) consider(c.id, componentTerminals(c))
  for (const port of doc.ports) consider(port.id, portTerminals(port))
  return best
}

/** Where a click lands: on a near terminal (attached), else on the grid. */
export function snapPoint(
  doc: ChipDocument,
  p: PointUm,
  opts: { pitch: number; terminalRadius: number },
): { point: PointUm; terminal: TerminalHit | null } {
  const terminal = nearestTerminal(doc, p, opts.terminalRadius)
  return terminal ? { point: { ...terminal.position }, terminal } : { point: snapToGrid(p, opts.pitch), terminal: null }
}
