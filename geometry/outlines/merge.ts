import polygonClipping from 'polygon-clipping'
import type { MultiPolygon, Polygon } from '../types'

const CHUNK = 2000

function unionAll(polys: Polygon[]): MultiPolygon {
  if (polys.length === 0) return []
  if (polys.length <= CHUNK) {
    const [first, ...rest] = polys
    return polygonClipping.union(first!, ...rest)
  }
  // Divide and conquer keeps argument lists short and each sweep small.
  const parts: MultiPolygon[] = []
  for (let i = 0; i < polys.length; i += CHUNK) parts.push(unionAll(polys.slice(i, i + CHUNK)))
  const [first, ...rest] = parts
  return polygonClipping.union(first!, ...rest)
}

/**
 * Snaps coordinates to a grid (µm). Edges that should coincide but differ by rounding after a rotation
 * (~1e-12 relative) would otherwise leave sliver notches in the union; 0.1 nm is far below any mask's resolution.
 */
const snap = (polys: Polygon[], grid: number): Polygon[] =>
  polys.map((p) => p.map((r) => r.map(([x, y]) => [Math.round(x / grid) * grid, Math.round(y / grid) * grid])))

/**
 * Union of all pieces of one layer with polygon-clipping (Martinez–Rueda sweep line; exterior rings
 * counter-clockwise, holes clockwise, rings closed by repeating the first point). Holes are kept.
 */
export function mergePieces(polys: Polygon[]): { merged: MultiPolygon; error?: string } {
  try {
    return { merged: unionAll(snap(polys, 1e-4)) }
  } catch (first) {
    try {
      return { merged: unionAll(snap(polys, 1e-3)) }
    } catch {
      return { merged: [], error: String((first as Error)?.message ?? first) }
    }
  }
}
