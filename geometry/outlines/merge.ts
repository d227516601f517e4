import polygonClipping from 'polygon-clipping'
import type { MultiPolygon, Pair, Polygon, Ring } from '../types'
import { closedUnion, toPaths } from '../clip'
import { DBU_PER_UM, fromDbu, snapPair, toDbu } from '../units'
import { pieceBox, pieceClusters, type Box } from './clusters'

export interface MergeResult {
  merged: MultiPolygon
  /** Set when a group of touching pieces could not be merged; that group is left out of `merged`. */
  error?: string
  /** A vertex of the first group that failed, to show on the canvas. */
  failedAt?: Pair
}

/** Snap grid of the previous engine (polygon-clipping, kept as the reference): 0.1 nm. */
const GRID = 1e-4

/** Cracks up to 4 database units wide (rounding, see closedUnion) are closed by the merge. */
const CLOSE = 2

/** Snaps coordinates to a grid (µm). */
const snap = (polys: readonly Polygon[], grid: number): Polygon[] =>
  polys.map(p => p.map(r => r.map(([x, y]) => [Math.round(x / grid) * grid, Math.round(y / grid) * grid])))

/**
 * A lone single-ring piece that is strictly convex after dropping repeated and collinear points needs no
 * sweep: the union of one convex polygon is itself (closed, counter-clockwise). Null when it is not.
 */
function convexAlone(p: Polygon): Polygon | null {
  if (p.length !== 1) return null
  const pts: Pair[] = []
  for (const q of p[0]!) {
    const last = pts[pts.length - 1]
    if (!last || last[0] !== q[0] || last[1] !== q[1]) pts.push(q)
  }
  if (pts.length > 1 && pts[0]![0] === pts[pts.length - 1]![0] && pts[0]![1] === pts[pts.length - 1]![1]) pts.pop()
  const n = pts.length
  if (n < 3) return null
  let sign = 0
  for (let i = 0; i < n; i++) {
    const a = pts[i]!
    const b = pts[(i + 1) % n]!
    const c = pts[(i + 2) % n]!
    const z = (b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0])
    if (z === 0) return null // collinear or doubled point: let the sweep clean it
    const s = Math.sign(z)
    if (sign === 0) sign = s
    else if (s !== sign) return null
  }
  // Strict convexity with one turning direction could still wind twice (a star); the angle sum rules that out.
  let turn = 0
  for (let i = 0; i < n; i++) {
    const a = pts[i]!
    const b = pts[(i + 1) % n]!
    const c = pts[(i + 2) % n]!
    turn += Math.atan2(
      (b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0]),
      (b[0] - a[0]) * (c[0] - b[0]) + (b[1] - a[1]) * (c[1] - b[1]),
    )
  }
  if (Math.abs(Math.abs(turn) - 2 * Math.PI) > 1e-6) return null
  const ring: Ring = sign > 0 ? pts : [...pts].reverse()
  return [[...ring, ring[0]!]]
}

/** Lowest-leftmost vertex of each part first: a stable order that does not depend on how pieces were grouped. */
function byPosition(parts: MultiPolygon): MultiPolygon {
  const lowest = (p: Polygon) => p[0]!.reduce((m, q) => (q[0] < m[0] || (q[0] === m[0] && q[1] < m[1]) ? q : m))
  const keyed = parts.map(p => ({ p, at: lowest(p) }))
  keyed.sort((a, b) => a.at[0] - b.at[0] || a.at[1] - b.at[1])
  return keyed.map(k => k.p)
}

const onGrid = (v: number) => fromDbu(toDbu(v))
/** A piece's box on the grid: rounding is monotonic, so it is the box of the snapped piece without snapping every point. */
const snappedBox = (p: Polygon): Box => {
  const [x0, y0, x1, y1] = pieceBox(p)
  return [onGrid(x0), onGrid(y0), onGrid(x1), onGrid(y1)]
}

/**
 * Union of all pieces of one layer on the integer database grid (1 nm, see units.ts) with Clipper2
 * (clip.ts; exterior rings counter-clockwise, holes clockwise, rings closed by repeating the first point).
 * Holes are kept; an island inside a hole is its own part.
 *
 * Pieces are first grouped into clusters that can touch (box overlap, see clusters.ts) and each cluster is
 * merged in one Clipper2 union: measured on the 4,096- and 16,384-nozzle chips this beats one union over the
 * whole layer (geometry/README.md, "Engine"). A lone strictly convex piece needs no union at all.
 */
export function mergePieces(polys: readonly Polygon[]): MergeResult {
  const merged: MultiPolygon = []
  let error: string | undefined
  let failedAt: Pair | undefined
  // Margin: one database unit, so pieces that touch after snapping are in one cluster.
  for (const ids of pieceClusters(polys, 2 / DBU_PER_UM, polys.map(snappedBox))) {
    try {
      const alone = ids.length === 1 ? convexAlone(polys[ids[0]!]!.map(r => r.map(snapPair))) : null
      if (alone) merged.push(alone)
      else merged.push(...closedUnion(toPaths(ids.map(i => polys[i]!)), CLOSE))
    } catch (e) {
      // Clipper2 on integers has no robustness failures; a throw here is a bug, reported rather than a broken file.
      error ??= String((e as Error)?.message ?? e)
      failedAt ??= polys[ids[0]!]?.[0]?.[0]
    }
  }
  const ordered = byPosition(merged)
  return error === undefined ? { merged: ordered } : { merged: ordered, error, ...(failedAt ? { failedAt } : {}) }
}

const SINGLE_SWEEP_CHUNK = 2000

/**
 * The previous engine — every piece of the layer in one polygon-clipping union (Martinez–Rueda sweep on
 * floating point, 0.1 nm snap; chunked at 2,000 pieces, whose results are unioned in one more sweep). Kept as
 * the reference that `mergePieces` is checked against (areas, parts, holes) in tests and the benchmark.
 */
export function mergePiecesSingleSweep(polys: readonly Polygon[]): MultiPolygon {
  const unionAll = (ps: Polygon[]): MultiPolygon => {
    if (ps.length === 0) return []
    if (ps.length <= SINGLE_SWEEP_CHUNK) return polygonClipping.union(ps[0]!, ...ps.slice(1))
    const parts: MultiPolygon[] = []
    for (let i = 0; i < ps.length; i += SINGLE_SWEEP_CHUNK) parts.push(unionAll(ps.slice(i, i + SINGLE_SWEEP_CHUNK)))
    return polygonClipping.union(parts[0]!, ...parts.slice(1))
  }
  return unionAll(snap(polys, GRID))
}
