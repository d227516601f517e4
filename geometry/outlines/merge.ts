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

/** Snaps coordinates to a 1 nm grid; used only to retry a union that failed on near-coincident edges. */
const snap = (polys: Polygon[]): Polygon[] =>
  polys.map((p) => p.map((r) => r.map(([x, y]) => [Math.round(x * 1000) / 1000, Math.round(y * 1000) / 1000])))

/**
 * Union of all pieces of one layer with polygon-clipping (Martinez–Rueda sweep line; exterior rings
 * counter-clockwise, holes clockwise, rings closed by repeating the first point). Holes are kept.
 */
export function mergePieces(polys: Polygon[]): { merged: MultiPolygon; error?: string } {
  try {
    return { merged: unionAll(polys) }
  } catch (first) {
    try {
      return { merged: unionAll(snap(polys)) }
    } catch {
      return { merged: [], error: String((first as Error)?.message ?? first) }
    }
  }
}
