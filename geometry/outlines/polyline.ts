import type { Pair, Polygon } from '../types'
import { add, cross, dot, leftNormal, length, scale, segmentsIntersect, sub, unit } from '../vec'

export interface StrokeOptions {
  /** Largest miter length as a multiple of the half-width before a join is bevelled (SVG's stroke-miterlimit idea). */
  miterLimit?: number
}

export type StrokeResult =
  | { ok: true; pieces: Polygon[] }
  | { ok: false; reason: 'degenerate' | 'doubles-back' | 'self-crossing'; at: Pair }

const EPS = 1e-9

/** Removes repeated points and interior points that lie straight on (collinear, same direction). */
export function cleanPolyline(points: readonly Pair[]): Pair[] {
  const out: Pair[] = []
  for (const p of points) {
    const last = out[out.length - 1]
    if (last && length(sub(p, last)) <= EPS) continue
    out.push(p)
  }
  for (let i = out.length - 2; i >= 1; i--) {
    const d0 = unit(sub(out[i]!, out[i - 1]!))
    const d1 = unit(sub(out[i + 1]!, out[i]!))
    if (Math.abs(cross(d0, d1)) <= 1e-12 && dot(d0, d1) > 0) out.splice(i, 1)
  }
  return out
}

/** First pair of non-adjacent segments that touch or cross, if any (all pairs: channel polylines are short). */
export function findSelfCrossing(pts: readonly Pair[]): Pair | null {
  for (let i = 0; i < pts.length - 1; i++) {
    for (let j = i + 2; j < pts.length - 1; j++) {
      if (segmentsIntersect(pts[i]!, pts[i + 1]!, pts[j]!, pts[j + 1]!)) return pts[j]!
    }
  }
  return null
}

/**
 * Sweeps a centre-line polyline with a constant width: one rectangle per segment (flat, butt ends: a channel
 * ends exactly at its end point), plus a miter or bevel wedge on the outer side of every turn. The pieces
 * overlap on the inner side and are merged by the layer union. Rejects self-crossing and doubling back.
 */
export function strokePolyline(points: readonly Pair[], width: number, options: StrokeOptions = {}): StrokeResult {
  const miterLimit = options.miterLimit ?? 2
  const pts = cleanPolyline(points)
  if (pts.length < 2 || !(width > 0)) return { ok: false, reason: 'degenerate', at: points[0] ?? [0, 0] }
  const h = width / 2
  const pieces: Polygon[] = []
  for (let i = 0; i < pts.length - 1; i++) {
    const a = pts[i]!
    const b = pts[i + 1]!
    const n = scale(leftNormal(unit(sub(b, a))), h)
    pieces.push([[sub(a, n), sub(b, n), add(b, n), add(a, n)]])
  }
  for (let i = 1; i < pts.length - 1; i++) {
    const v = pts[i]!
    const d0 = unit(sub(v, pts[i - 1]!))
    const d1 = unit(sub(pts[i + 1]!, v))
    const turn = cross(d0, d1)
    if (Math.abs(turn) <= 1e-12) {
      if (dot(d0, d1) < 0) return { ok: false, reason: 'doubles-back', at: v }
      continue
    }
    // Outer side of the turn: right of the path for a left turn, left for a right turn.
    const side = turn > 0 ? -1 : 1
    const n0 = scale(leftNormal(d0), side)
    const n1 = scale(leftNormal(d1), side)
    const bis = unit(add(n0, n1))
    const cosHalf = dot(bis, n0) // cos of half the turn angle
    const p0 = add(v, scale(n0, h))
    const p1 = add(v, scale(n1, h))
    if (cosHalf > 1e-9 && 1 / cosHalf <= miterLimit) {
      pieces.push([[v, p0, add(v, scale(bis, h / cosHalf)), p1]])
    } else {
      pieces.push([[v, p0, p1]])
    }
  }
  const crossing = findSelfCrossing(pts)
  if (crossing) return { ok: false, reason: 'self-crossing', at: crossing }
  return { ok: true, pieces }
}
