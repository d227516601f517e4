import type { Pair, Polygon } from '../types'

/** Fewest and most sides of a tessellated circle: the work per circle is bounded whatever its radius. */
export const MIN_CIRCLE_SEGMENTS = 8
export const MAX_CIRCLE_SEGMENTS = 512

/**
 * Number of sides for a polygon inscribed in a circle of radius r whose chord error (sagitta) stays ≤ tol:
 * sagitta s = r·(1 − cos(π/n)) = 2r·sin²(π/2n) (elementary geometry), so n ≥ π / (2·asin(√(tol/2r))) — the
 * half-angle form, which keeps its precision when tol/r is far below the double's epsilon (1 − cos does not).
 * Clamped to 8…512 sides: at 512 the chord error is 1.9e-5·r, 0.1 µm on a 10 mm punch (the document's
 * largest) and far below any mask's resolution on anything smaller; a wrong radius (1e29 µm) costs 512
 * points, not an unbounded loop. Invalid radius or tolerance → 8.
 */
export function circleSegments(radius: number, tolerance: number): number {
  if (!(radius > 0) || !(tolerance > 0) || !Number.isFinite(radius)) return MIN_CIRCLE_SEGMENTS
  if (tolerance >= radius) return MIN_CIRCLE_SEGMENTS
  const n = Math.ceil(Math.PI / (2 * Math.asin(Math.sqrt(tolerance / (2 * radius)))))
  return Number.isFinite(n) ? Math.min(MAX_CIRCLE_SEGMENTS, Math.max(MIN_CIRCLE_SEGMENTS, n)) : MAX_CIRCLE_SEGMENTS
}

/** A counter-clockwise regular polygon inscribed in the circle. */
export function circlePolygon(center: Pair, radius: number, tolerance: number): Polygon {
  const n = circleSegments(radius, tolerance)
  const ring: Pair[] = []
  for (let i = 0; i < n; i++) {
    const a = (2 * Math.PI * i) / n
    ring.push([center[0] + radius * Math.cos(a), center[1] + radius * Math.sin(a)])
  }
  return [ring]
}

/**
 * Points along a circular arc from angle a0 to a1 (radians), chord error ≤ tol, both ends included. The count
 * is the circle's (capped, see circleSegments) times the arc's share of a turn, at most one turn's worth.
 */
export function arcPoints(center: Pair, radius: number, a0: number, a1: number, tolerance: number): Pair[] {
  const full = circleSegments(radius, tolerance)
  const turns = Math.min(1, Math.abs(a1 - a0) / (2 * Math.PI))
  const n = Math.max(2, Math.ceil(turns * full))
  const pts: Pair[] = []
  for (let i = 0; i <= n; i++) {
    const a = a0 + ((a1 - a0) * i) / n
    pts.push([center[0] + radius * Math.cos(a), center[1] + radius * Math.sin(a)])
  }
  return pts
}
