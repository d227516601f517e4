import type { Pair, Polygon } from '../types'
import { strokeOpenPath } from '../clip'
import { toDbu } from '../units'
import { cross, dot, length, segmentsIntersect, sub, unit } from '../vec'

export interface StrokeOptions {
  /** Largest miter length as a multiple of the half-width before a join is squared off (Clipper2's miter limit). */
  miterLimit?: number
}

export type StrokeResult =
  { ok: true; pieces: Polygon[] } | { ok: false; reason: 'degenerate' | 'doubles-back' | 'self-crossing'; at: Pair }

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
 * Sweeps a centre-line polyline with a constant width by Clipper2's open-path offsetting (clip.ts) on the
 * integer database grid: butt ends (a channel ends exactly at its end point), mitred joins up to a miter
 * length of `miterLimit` × the half-width, squared off beyond (the library's join; it replaced a hand-written
 * stroker that bevelled). One piece per channel, rings open (no repeated first point), on the 1 nm grid.
 * Rejects self-crossing and doubling back, which a mask must not silently merge.
 */
export function strokePolyline(points: readonly Pair[], width: number, options: StrokeOptions = {}): StrokeResult {
  const miterLimit = options.miterLimit ?? 2
  const pts = cleanPolyline(points)
  if (pts.length < 2 || !(width > 0)) return { ok: false, reason: 'degenerate', at: points[0] ?? [0, 0] }
  for (let i = 1; i < pts.length - 1; i++) {
    const v = pts[i]!
    const d0 = unit(sub(v, pts[i - 1]!))
    const d1 = unit(sub(pts[i + 1]!, v))
    if (Math.abs(cross(d0, d1)) <= 1e-12 && dot(d0, d1) < 0) return { ok: false, reason: 'doubles-back', at: v }
  }
  const crossing = findSelfCrossing(pts)
  if (crossing) return { ok: false, reason: 'self-crossing', at: crossing }
  if (toDbu(width / 2) <= 0) return { ok: false, reason: 'degenerate', at: pts[0]! }
  const outline = strokeOpenPath(pts, width / 2, miterLimit)
  const pieces: Polygon[] = outline.map(poly => poly.map(ring => ring.slice(0, -1)))
  if (pieces.length === 0) return { ok: false, reason: 'degenerate', at: pts[0]! }
  return { ok: true, pieces }
}
