// Which element is under a point: point-in-polygon on the element pieces (µm), with a flatbush index on the
// pieces' boxes so a 512-nozzle chip answers in microseconds.
import Flatbush from 'flatbush'
import type { Pair, Polygon } from '~~/geometry/types'

export interface HitPiece { elementId: string; layerId: string; polygon: Polygon; area: number }

export interface ElementIndex { pieces: HitPiece[]; tree: Flatbush | null }

/** Even-odd point-in-ring test (ring open or closed). */
export function pointInRing(x: number, y: number, ring: Pair[]): boolean {
  let inside = false
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!
    const [xj, yj] = ring[j]!
    if ((yi > y) !== (yj > y) && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside
  }
  return inside
}

/** Inside the exterior ring and outside every hole. */
export function pointInPolygon(x: number, y: number, polygon: Polygon): boolean {
  const [outer, ...holes] = polygon
  if (!outer || !pointInRing(x, y, outer)) return false
  return !holes.some((h) => pointInRing(x, y, h))
}

/** Distance from a point to the polygon's boundary, 0 when inside. */
export function distanceToPolygon(x: number, y: number, polygon: Polygon): number {
  if (pointInPolygon(x, y, polygon)) return 0
  let best = Infinity
  for (const ring of polygon) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      best = Math.min(best, segmentDistance(x, y, ring[j]!, ring[i]!))
    }
  }
  return best
}

function segmentDistance(x: number, y: number, a: Pair, b: Pair): number {
  const dx = b[0] - a[0]
  const dy = b[1] - a[1]
  const len2 = dx * dx + dy * dy
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((x - a[0]) * dx + (y - a[1]) * dy) / len2)) : 0
  return Math.hypot(x - (a[0] + t * dx), y - (a[1] + t * dy))
}

/** Unsigned area of the exterior ring minus holes. */
export function polygonArea(polygon: Polygon): number {
  return polygon.reduce((s, ring, i) => s + (i === 0 ? 1 : -1) * Math.abs(signedArea(ring)), 0)
}

export function signedArea(ring: Pair[]): number {
  let s = 0
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) s += ring[j]![0] * ring[i]![1] - ring[i]![0] * ring[j]![1]
  return s / 2
}

// Pieces are reused across edits (scene.ts keeps every untouched element's pieces), so are their areas.
const areas = new WeakMap<Polygon, number>()
const areaOf = (p: Polygon): number => { let a = areas.get(p); if (a === undefined) { a = polygonArea(p); areas.set(p, a) } return a }

/** Builds the index once per document. */
export function buildElementIndex(elements: Array<{ elementId: string; layerId: string; pieces: Polygon[] }>): ElementIndex {
  const pieces: HitPiece[] = []
  for (const e of elements) for (const p of e.pieces) if (p[0] && p[0].length >= 3) pieces.push({ elementId: e.elementId, layerId: e.layerId, polygon: p, area: areaOf(p) })
  if (pieces.length === 0) return { pieces, tree: null }
  const tree = new Flatbush(pieces.length)
  for (const p of pieces) {
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity
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
    if (!best || d < best.d - 1e-9 || (Math.abs(d - best.d) <= 1e-9 && p.area < best.area)) best = { d, area: p.area, id: p.elementId }
  }
  return best?.id ?? null
}
