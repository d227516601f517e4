import polygonClipping from 'polygon-clipping'
import type { MultiPolygon, Pair, Polygon, Ring } from '../types'
import { pieceBox, pieceClusters } from './clusters'

/** Snap grid (µm) and the coarser grid of the retry; 0.1 nm is far below any mask's resolution. */
const GRID = 1e-4
const RETRY_GRID = 1e-3
/** Pieces per leaf of the union tree: small sweeps, few rings in each sweep's status. */
const LEAF = 32

export interface MergeResult {
  merged: MultiPolygon
  /** Set when a group of touching pieces could not be merged; that group is left out of `merged`. */
  error?: string
  /** A vertex of the first group that failed, to show on the canvas. */
  failedAt?: Pair
}

/**
 * Snaps coordinates to a grid (µm). Edges that should coincide but differ by rounding after a rotation
 * (~1e-12 relative) would otherwise leave sliver notches in the union.
 */
const snap = (polys: readonly Polygon[], grid: number): Polygon[] =>
  polys.map((p) => p.map((r) => r.map(([x, y]) => [Math.round(x / grid) * grid, Math.round(y / grid) * grid])))

const union = (a: MultiPolygon, b: MultiPolygon): MultiPolygon =>
  a.length === 0 ? b : b.length === 0 ? a : polygonClipping.union(a, b)

/**
 * Union of one group of pieces as a balanced tree: the pieces are split in halves at the median of their box
 * centres along the group's longer side (a k-d split), each half is merged, then the two results. One
 * polygon-clipping sweep over many pieces carries every ring it has crossed in each segment's state, which
 * grows with the pieces stacked across the sweep line (quadratic for a long ladder); spatially coherent
 * halves keep each sweep's input to a few merged rings. O(n log² n) for pieces of bounded size.
 */
function unionTree(polys: readonly Polygon[], boxes: readonly (readonly number[])[], ids: number[]): MultiPolygon {
  if (ids.length <= LEAF) {
    const [first, ...rest] = ids.map((i) => polys[i]!)
    return first ? polygonClipping.union(first, ...rest) : []
  }
  let x0 = Infinity; let y0 = Infinity; let x1 = -Infinity; let y1 = -Infinity
  for (const i of ids) {
    const b = boxes[i]!
    x0 = Math.min(x0, b[0]!); y0 = Math.min(y0, b[1]!); x1 = Math.max(x1, b[2]!); y1 = Math.max(y1, b[3]!)
  }
  const axis = x1 - x0 >= y1 - y0 ? 0 : 1
  const centre = (i: number) => boxes[i]![axis]! + boxes[i]![axis + 2]!
  const sorted = [...ids].sort((i, j) => centre(i) - centre(j) || i - j)
  const half = sorted.length >> 1
  return union(unionTree(polys, boxes, sorted.slice(0, half)), unionTree(polys, boxes, sorted.slice(half)))
}

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
    turn += Math.atan2((b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0]), (b[0] - a[0]) * (c[0] - b[0]) + (b[1] - a[1]) * (c[1] - b[1]))
  }
  if (Math.abs(Math.abs(turn) - 2 * Math.PI) > 1e-6) return null
  const ring: Ring = sign > 0 ? pts : [...pts].reverse()
  return [[...ring, ring[0]!]]
}

/** Swaps x and y of every point; the mirror image reverses each ring's turning, so rings are reversed too. */
const transposed = (polys: readonly Polygon[]): Polygon[] =>
  polys.map((p) => p.map((r) => r.map(([x, y]): Pair => [y, x]).reverse()))

function mergeGroup(polys: readonly Polygon[]): MultiPolygon {
  if (polys.length === 1) {
    const alone = convexAlone(polys[0]!)
    if (alone) return [alone]
  }
  const boxes = polys.map(pieceBox)
  let x0 = Infinity; let y0 = Infinity; let x1 = -Infinity; let y1 = -Infinity
  for (const b of boxes) {
    x0 = Math.min(x0, b[0]); y0 = Math.min(y0, b[1]); x1 = Math.max(x1, b[2]); y1 = Math.max(y1, b[3])
  }
  // polygon-clipping sweeps along x, and each segment's state carries the rings the sweep line crosses: a
  // group taller than wide (a step array's nozzles along y on their supply) puts every nozzle on the sweep
  // line at once — quadratic, 4 GB for 20 000 nozzles. Merged transposed, the sweep runs along the long side.
  if (y1 - y0 > x1 - x0) return transposed(mergeGroup(transposed(polys)) as Polygon[])
  return unionTree(polys, boxes, polys.map((_, i) => i))
}

/** Lowest-leftmost vertex of each part first: a stable order that does not depend on how pieces were grouped. */
function byPosition(a: Polygon, b: Polygon): number {
  const lowest = (p: Polygon) => p[0]!.reduce((m, q) => (q[0] < m[0] || (q[0] === m[0] && q[1] < m[1]) ? q : m))
  const pa = lowest(a)
  const pb = lowest(b)
  return pa[0] - pb[0] || pa[1] - pb[1]
}

/**
 * Union of all pieces of one layer with polygon-clipping (Martinez–Rueda sweep line; exterior rings
 * counter-clockwise, holes clockwise, rings closed by repeating the first point). Holes are kept.
 *
 * Pieces are first grouped into clusters that can touch (box overlap, see clusters.ts); each cluster is merged
 * on its own as a balanced union tree and the results are collected. Pieces are snapped to a 0.1 nm grid; a
 * cluster the sweep cannot merge is retried on a 1 nm grid, and if that fails too it is left out and reported.
 */
export function mergePieces(polys: readonly Polygon[]): MergeResult {
  const snapped = snap(polys, GRID)
  const merged: MultiPolygon = []
  let error: string | undefined
  let failedAt: Pair | undefined
  // Margin: pieces further apart than two retry-grid cells cannot touch after snapping to either grid.
  for (const ids of pieceClusters(snapped, 2 * RETRY_GRID)) {
    try {
      merged.push(...mergeGroup(ids.map((i) => snapped[i]!)))
    } catch (first) {
      try {
        merged.push(...mergeGroup(snap(ids.map((i) => polys[i]!), RETRY_GRID)))
      } catch {
        error ??= String((first as Error)?.message ?? first)
        failedAt ??= polys[ids[0]!]?.[0]?.[0]
      }
    }
  }
  merged.sort(byPosition)
  return error === undefined ? { merged } : { merged, error, ...(failedAt ? { failedAt } : {}) }
}

const SINGLE_SWEEP_CHUNK = 2000

/**
 * The plain way — every piece of the layer in one polygon-clipping union (chunked at 2,000 pieces, whose
 * results are unioned in one more sweep). Kept to check `mergePieces` against in tests and the benchmark.
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
