// Keeps channel ends on the terminals they are attached to after components or ports move or turn.
import { componentTerminals, portTerminals } from '../schemas/chip'
import type { ChipDocument } from '../schemas/chip'
import type { PointUm } from './types'

/** Where a named terminal of an element sits now (µm), or null when the element or terminal is gone. */
export function terminalPosition(doc: ChipDocument, element: string, terminal: string): PointUm | null {
  const c = doc.components.find(x => x.id === element)
  if (c) return componentTerminals(c).find(t => t.name === terminal)?.position ?? null
  const p = doc.ports.find(x => x.id === element)
  if (p) return terminal === 'port' ? portTerminals(p)[0]!.position : null
  return null
}

/** Moves the attached ends of channels that touch `touched` (element or channel ids) onto their terminals. */
export function reattach(doc: ChipDocument, touched: ReadonlySet<string>): ChipDocument {
  let changed = false
  const channels = doc.channels.map(ch => {
    const points = [...ch.points]
    let moved = false
    for (const [ref, index] of [
      [ch.start, 0],
      [ch.end, points.length - 1],
    ] as const) {
      if (!ref || !(touched.has(ref.element) || touched.has(ch.id))) continue
      const at = terminalPosition(doc, ref.element, ref.terminal)
      const old = points[index]!
      if (at && (Math.abs(at.x - old.x) > 1e-9 || Math.abs(at.y - old.y) > 1e-9)) {
        points[index] = { x: at.x, y: at.y }
        moved = true
      }
    }
    if (!moved) return ch
    changed = true
    return { ...ch, points }
  })
  return changed ? { ...doc, channels } : doc
}
