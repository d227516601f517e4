import type { ChipDocument } from '#shared/schemas/chip'
import type { ElementPieces, GeometryProblem, Pair, Polygon } from '../types'
import { circlePolygon } from './circle'
import { componentPieces } from './components'
import { strokePolyline } from './polyline'
import { rect, place } from './shapes'

/** The DXF/merge key for alignment marks and text; never a document layer id (ids cannot start with "_"). */
export const MARKS_LAYER = '_marks'

const REASON_TEXT = {
  degenerate: 'has no length: give it at least two distinct points',
  'doubles-back': 'doubles back on itself: remove the point where it reverses',
  'self-crossing': 'crosses itself: move its points so the path does not cross',
} as const

/** Every element of the document as pieces on its layers, plus the elements that could not be drawn. */
export function documentPieces(
  doc: ChipDocument,
  tolerance: number,
): { elements: ElementPieces[]; problems: GeometryProblem[] } {
  const elements: ElementPieces[] = []
  const problems: GeometryProblem[] = []

  for (const ch of doc.channels) {
    const pts = ch.points.map((p): Pair => [p.x, p.y])
    const s = strokePolyline(pts, ch.width)
    if (s.ok) {
      elements.push({ elementId: ch.id, kind: 'channel', layerId: ch.layerId, pieces: s.pieces })
    } else {
      problems.push({
        rule: s.reason === 'degenerate' ? 'degenerate-channel' : s.reason,
        elementId: ch.id,
        message: `Channel "${ch.id}" ${REASON_TEXT[s.reason]}; it is left out of the mask until fixed`,
        location: { x: s.at[0], y: s.at[1] },
      })
    }
  }
  for (const c of doc.components) {
    for (const { layerId, pieces } of componentPieces(c, tolerance)) {
      elements.push({ elementId: c.id, kind: 'component', layerId, pieces })
    }
  }
  for (const p of doc.ports) {
    elements.push({
      elementId: p.id,
      kind: 'port',
      layerId: p.layerId,
      pieces: [circlePolygon([p.position.x, p.position.y], p.punchDiameter / 2, tolerance)],
    })
  }
  for (const m of doc.marks) {
    if (m.kind !== 'cross') continue // text goes to the DXF text layer only (no stroke font in the mask)
    const arms: Polygon[] = [
      place(rect(-m.size / 2, m.size / 2, -m.lineWidth / 2, m.lineWidth / 2), m.position, 0),
      place(rect(-m.lineWidth / 2, m.lineWidth / 2, -m.size / 2, m.size / 2), m.position, 0),
    ]
    for (const layerId of [MARKS_LAYER, ...m.layerIds])
      elements.push({ elementId: m.id, kind: 'mark', layerId, pieces: arms })
  }
  return { elements, problems }
}

/** The chip outline as one counter-clockwise ring (µm), or null when the document has none. */
export function chipOutlineRing(doc: ChipDocument): Pair[] | null {
  const o = doc.outline
  if (!o) return null
  if (o.kind === 'rectangle') {
    const { x, y } = o.corner
    return [
      [x, y],
      [x + o.width, y],
      [x + o.width, y + o.height],
      [x, y + o.height],
    ]
  }
  const ring = o.points.map((p): Pair => [p.x, p.y])
  let s = 0
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i]!
    const b = ring[(i + 1) % ring.length]!
    s += a[0] * b[1] - b[0] * a[1]
  }
  return s < 0 ? ring.reverse() : ring
}
