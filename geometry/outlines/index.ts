import type { ChipDocument } from '#shared/schemas/chip'
import type { ElementPieces, GeometryProblem, MultiPolygon, Pair } from '../types'
import { chipOutlineRing, documentPieces, MARKS_LAYER } from './elements'
import { mergePieces } from './merge'

export interface LayerOutline {
  layerId: string
  name: string
  /** Depth in µm. */
  depth: number
  /** Merged outlines: polygons of [exterior CCW, ...holes CW], rings closed (first point repeated). */
  polygons: MultiPolygon
}

export interface TextItem {
  id: string
  text: string
  position: { x: number; y: number }
  height: number
}

export interface ChipOutlines {
  layers: LayerOutline[]
  /** Merged alignment-mark outlines (the marks layer). */
  marks: MultiPolygon
  texts: TextItem[]
  /** Chip edge, counter-clockwise, open ring; null when the document has no outline. */
  chipOutline: Pair[] | null
  /** Per-element pieces with their element ids (unmerged) — what the editor draws and hit-tests. */
  elements: ElementPieces[]
  problems: GeometryProblem[]
}

export interface OutlineOptions {
  /** Largest chord error for arcs and punch circles, µm (default 0.1 µm). */
  tolerance?: number
}

/** The whole document as outlines: merged per layer, plus per-element pieces for drawing and lookup. */
export function buildOutlines(doc: ChipDocument, options: OutlineOptions = {}): ChipOutlines {
  const tolerance = options.tolerance ?? 0.1
  const { elements, problems } = documentPieces(doc, tolerance)
  const byLayer = new Map<string, ElementPieces[]>()
  for (const e of elements) {
    const list = byLayer.get(e.layerId) ?? []
    list.push(e)
    byLayer.set(e.layerId, list)
  }
  const merge = (layerId: string): MultiPolygon => {
    const items = byLayer.get(layerId) ?? []
    const r = mergePieces(items.flatMap(e => e.pieces))
    if (r.error) {
      const at = r.failedAt
      const culprit = (at && items.find(e => e.pieces.some(piece => piece[0]?.[0] === at))) ?? items[0]
      const where = at ?? culprit?.pieces[0]?.[0]?.[0]
      problems.push({
        rule: 'merge-failed',
        elementId: culprit?.elementId ?? layerId,
        message: `Outlines touching "${culprit?.elementId ?? layerId}" on layer "${layerId}" could not be merged (${r.error}) and are left out of the mask: move nearly touching edges apart or onto each other`,
        location: { x: where?.[0] ?? 0, y: where?.[1] ?? 0 },
      })
    }
    return r.merged
  }
  const layers = doc.layers.map(l => ({ layerId: l.id, name: l.name, depth: l.depth, polygons: merge(l.id) }))
  const texts = doc.marks.flatMap(m =>
    m.kind === 'text' ? [{ id: m.id, text: m.text, position: m.position, height: m.height }] : [],
  )
  return { layers, marks: merge(MARKS_LAYER), texts, chipOutline: chipOutlineRing(doc), elements, problems }
}

export { MARKS_LAYER }
export { mergePieces, mergePiecesSingleSweep } from './merge'
export type { MergeResult } from './merge'
export { pieceClusters } from './clusters'
export { strokePolyline, cleanPolyline, findSelfCrossing } from './polyline'
export { circleSegments, circlePolygon, MAX_CIRCLE_SEGMENTS, MIN_CIRCLE_SEGMENTS } from './circle'
