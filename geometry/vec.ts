import type { Pair } from './types'

// Plain 2D vector algebra on [x, y] pairs (elementary analytic geometry).
export const sub = (a: Pair, b: Pair): Pair => [a[0] - b[0], a[1] - b[1]]
export const add = (a: Pair, b: Pair): Pair => [a[0] + b[0], a[1] + b[1]]
export const scale = (a: Pair, k: number): Pair => [a[0] * k, a[1] * k]
export const dot = (a: Pair, b: Pair): number => a[0] * b[0] + a[1] * b[1]
export const cross = (a: Pair, b: Pair): number => a[0] * b[1] - a[1] * b[0]
export const length = (a: Pair): number => Math.hypot(a[0], a[1])
export const unit = (a: Pair): Pair => {
  const l = length(a)
  return l === 0 ? [0, 0] : [a[0] / l, a[1] / l]
}
/** Left-hand normal (rotate +90°). */
export const leftNormal = (a: Pair): Pair => [-a[1], a[0]]

/** Signed area by the shoelace formula (positive when counter-clockwise); accepts closed or open rings. */
export function signedArea(ring: readonly Pair[]): number {
  let s = 0
  for (let i = 0, n = ring.length; i < n; i++) {
    const p = ring[i]!
    const q = ring[(i + 1) % n]!
    s += p[0] * q[1] - q[0] * p[1]
  }
  return s / 2
}

/** Closest distance between segments ab and cd, and the closest points (exact for non-degenerate input). */
export function segmentDistance(a: Pair, b: Pair, c: Pair, d: Pair): { distance: number; p: Pair; q: Pair } {
  if (segmentsIntersect(a, b, c, d)) {
    return { distance: 0, p: a, q: a }
  }
  const cands: [Pair, Pair][] = [
    [a, closestOnSegment(a, c, d)],
    [b, closestOnSegment(b, c, d)],
    [closestOnSegment(c, a, b), c],
    [closestOnSegment(d, a, b), d],
  ]
  let best = cands[0]!
  let bestD = Infinity
  for (const [p, q] of cands) {
    const dd = length(sub(q, p))
    if (dd < bestD) {
      bestD = dd
      best = [p, q]
    }
  }
  return { distance: bestD, p: best[0], q: best[1] }
}

export function closestOnSegment(p: Pair, a: Pair, b: Pair): Pair {
  const ab = sub(b, a)
  const l2 = dot(ab, ab)
  if (l2 === 0) return a
  const t = Math.max(0, Math.min(1, dot(sub(p, a), ab) / l2))
  return add(a, scale(ab, t))
}

/** Proper or touching intersection of two segments (orientation test, e.g. Cormen et al., CLRS §33.1). */
export function segmentsIntersect(a: Pair, b: Pair, c: Pair, d: Pair): boolean {
  const d1 = cross(sub(d, c), sub(a, c))
  const d2 = cross(sub(d, c), sub(b, c))
  const d3 = cross(sub(b, a), sub(c, a))
  const d4 = cross(sub(b, a), sub(d, a))
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true
  const on = (p: Pair, q: Pair, r: Pair) =>
    Math.min(p[0], q[0]) <= r[0] &&
    r[0] <= Math.max(p[0], q[0]) &&
    Math.min(p[1], q[1]) <= r[1] &&
    r[1] <= Math.max(p[1], q[1])
  return (
    (d1 === 0 && on(c, d, a)) || (d2 === 0 && on(c, d, b)) || (d3 === 0 && on(a, b, c)) || (d4 === 0 && on(a, b, d))
  )
}

/** Point in polygon by the even–odd crossing rule (Shimrat 1962, Algorithm 112, CACM 5(8):434). */
export function pointInRing(p: Pair, ring: readonly Pair[]): boolean {
  let inside = false
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!
    const [xj, yj] = ring[j]!
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside
  }
  return inside
}

/** Inside a polygon's exterior ring and outside every hole (rings as in `Polygon`: outer first). */
export function pointInPolygon(p: Pair, polygon: readonly (readonly Pair[])[]): boolean {
  const [outer, ...holes] = polygon
  if (!outer || !pointInRing(p, outer)) return false
  return !holes.some(h => pointInRing(p, h))
}

/** Distance from a point to a polygon's boundary, 0 inside it. */
export function distanceToPolygon(p: Pair, polygon: readonly (readonly Pair[])[]): number {
  if (pointInPolygon(p, polygon)) return 0
  let best = Infinity
  for (const ring of polygon) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++)
      best = Math.min(best, length(sub(p, closestOnSegment(p, ring[j]!, ring[i]!))))
  }
  return best
}

/** Unsigned area of the exterior ring minus the holes'. */
export function polygonArea(polygon: readonly (readonly Pair[])[]): number {
  return polygon.reduce((s, ring, i) => s + (i === 0 ? 1 : -1) * Math.abs(signedArea(ring)), 0)
}
