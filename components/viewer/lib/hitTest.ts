// Which element is under a point: point-in-polygon on the element pieces (µm), with a flatbush index on the
// pieces' boxes so a 512-nozzle chip answers in microseconds.
import Flatbush from 'flatbush'
import type { Polygon } from '~~/geometry/types'
import { distanceToPolygon as distanceTo, pointInPolygon as inPolygon, polygonArea, signedArea } from '~~/geometry/vec'

export interface HitPiece {
  elementId: string
  layerId: string
  polygon: Polygon
  area: number
}

export interface ElementIndex {
  pieces: HitPiece[]
  tree: Flatbush | null
}

// The point tests are geometry's own (geometry/vec.ts); this file keeps the index over the pieces.
export const pointInPolygon = (x: number, y: number, polygon: Polygon): boolean => inPolygon([x, y], polygon)
export const distanceToPolygon = (x: number, y: number, polygon: Polygon): number => distanceTo([x, y], polygon)
export { polygonArea, signedArea }

// Pieces are reused across edits (scene.ts keeps every untouched element's pieces), so are their areas.
const areas = new WeakMap<Polygon, number>()
const areaOf = (p: Polygon): number => {
  let a = areas.get(p)
  if (a === undefined) {
    a = polygonArea(p)
    areas.set(p, a)
  }
  return a
}

/** Builds the index once per document. */
export function buildElementIndex(
  elements: Array<{ elementId: string; layerId: string; pieces: Polygon[] }>,
): ElementIndex {
  const pieces: HitPiece[] = []
  for (const e of elements)
    for (const p of e.pieces)
      if (p[0] && p[0].length >= 3)
        pieces.push({ elementId: e.elementId, layerId: e.layerId, polygon: p, area: areaOf(p) })
  if (pieces.length === 0) return { pieces, tree: null }
  const tree = new Flatbush(pieces.length)
  for (const p of pieces) {
    let minX = Infinity,
      minY = Infinity,
      maxX = -Infinity,
      maxY = -Infinity
    for (const [x, y] of p.polygon[0]!) {
      if (x < minX) minX = x
      if (x > maxX) maxX = x
      if (y < minY) minY = y
      if (y > maxY) maxY = y
    }
    tree.add(minX, minY, maxX, maxY)
  }
  tree.finish()
  return { pieces, tree }
}

export interface HitOptions {
  /** Also accept pieces within this distance, µm (e.g. a few screen pixels at the current zoom). */
  toleranceUm?: number
  /** Only pieces on these layers (e.g. the visible ones). */
  layerIds?: ReadonlySet<string>
}

/**
 * The element under (x, y) µm, or null. A piece that contains the point beats one that is only near it; among
 * several, the smallest piece wins, so a junction is picked over the wide channel or port it sits on.
 */
export function hitTest(index: ElementIndex, x: number, y: number, options: HitOptions = {}): string | null {
  if (!index.tree) return null
  const tol = Math.max(0, options.toleranceUm ?? 0)
  let best: { d: number; area: number; id: string } | null = null
  for (const i of index.tree.search(x - tol, y - tol, x + tol, y + tol)) {
    const p = index.pieces[i]!
    if (options.layerIds && !options.layerIds.has(p.layerId)) continue
    const d = distanceToPolygon(x, y, p.polygon)
    if (d > tol) continue
    if (!best || d < best.d - 1e-9 || (Math.abs(d - best.d) <= 1e-9 && p.area < best.area))
      best = { d, area: p.area, id: p.elementId }
  }
  return best?.id ?? null
}
