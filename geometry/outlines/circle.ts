import type { Pair, Polygon } from '../types'

/**
 * Number of sides for a polygon inscribed in a circle of radius r whose chord error (sagitta) stays ≤ tol:
 * sagitta s = r·(1 − cos(π/n)) (elementary geometry), so n ≥ π / acos(1 − tol/r). At least 8 sides.
 */
export function circleSegments(radius: number, tolerance: number): number {
  if (!(radius > 0) || !(tolerance > 0)) return 8
  if (tolerance >= radius) return 8
  return Math.max(8, Math.ceil(Math.PI / Math.acos(1 - tolerance / radius)))
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

/** Points along a circular arc from angle a0 to a1 (radians), chord error ≤ tol, both ends included. */
export function arcPoints(center: Pair, radius: number, a0: number, a1: number, tolerance: number): Pair[] {
  const full = circleSegments(radius, tolerance)
  const n = Math.max(2, Math.ceil((Math.abs(a1 - a0) / (2 * Math.PI)) * full))
  const pts: Pair[] = []
  for (let i = 0; i <= n; i++) {
    const a = a0 + ((a1 - a0) * i) / n
    pts.push([center[0] + radius * Math.cos(a), center[1] + radius * Math.sin(a)])
  }
  return pts
}
