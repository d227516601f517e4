// Thin layer over Clipper2 (Angus Johnson's polygon clipping and offsetting library, through clipper2-ts, its
// maintained TypeScript port; Boost licence): converts µm rings to integer paths in database units (units.ts)
// and back, and turns Clipper's polygon trees into our MultiPolygon (exterior CCW, holes CW, rings closed).
// The algorithm is Vatti's scan-beam clipping (Vatti 1992, Communications of the ACM 35(7), 56–63).
import {
  ClipType,
  Clipper64,
  ClipperOffset,
  EndType,
  FillRule,
  JoinType,
  PolyTree64,
  type Path64,
  type Paths64,
  type PolyPath64,
} from 'clipper2-ts'
import type { MultiPolygon, Pair, Polygon, Ring } from './types'
import { DBU_PER_UM, fromDbu } from './units'

/** One µm ring as an integer path (database units), without the closing repeat of its first point. */
export function toPath(ring: readonly Pair[], perUm = DBU_PER_UM): Path64 {
  const out: Path64 = []
  for (const [x, y] of ring) out.push({ x: Math.round(x * perUm), y: Math.round(y * perUm) })
  const f = out[0]
  const l = out[out.length - 1]
  if (out.length > 1 && f && l && f.x === l.x && f.y === l.y) out.pop()
  return out
}

/** Every ring of the polygons (exteriors and holes) as integer paths; non-zero filling gives their union. */
export const toPaths = (polys: readonly Polygon[]): Paths64 => polys.flatMap(p => p.map(r => toPath(r)))

/** An integer path as a closed µm ring. */
export function fromPath(path: Path64, perUm = DBU_PER_UM): Ring {
  const ring: Ring =
    perUm === DBU_PER_UM
      ? path.map((q): Pair => [fromDbu(q.x), fromDbu(q.y)])
      : path.map((q): Pair => [
          fromDbu(Math.round((q.x / perUm) * DBU_PER_UM)),
          fromDbu(Math.round((q.y / perUm) * DBU_PER_UM)),
        ])
  if (ring.length > 0) ring.push([ring[0]![0], ring[0]![1]])
  return ring
}

/** Clipper's polygon tree as polygons: each outer path with its holes; islands inside holes become polygons of their own. */
export function treeToMultiPolygon(tree: PolyPath64, perUm = DBU_PER_UM): MultiPolygon {
  const out: MultiPolygon = []
  const visitOuter = (node: PolyPath64) => {
    const poly: Polygon = [fromPath(node.poly!, perUm)]
    for (let i = 0; i < node.count; i++) {
      const hole = node.child(i)
      poly.push(fromPath(hole.poly!, perUm))
      for (let j = 0; j < hole.count; j++) visitOuter(hole.child(j))
    }
    out.push(poly)
  }
  for (let i = 0; i < tree.count; i++) visitOuter(tree.child(i))
  return out
}

/**
 * Union (non-zero fill) of integer paths as a polygon tree. Clipper2 returns outer paths with positive area
 * (counter-clockwise with y up) and holes negative (clockwise) — our orientation.
 */
export function unionPaths(paths: Paths64): MultiPolygon {
  const c = new Clipper64()
  c.addSubject(paths)
  const tree = new PolyTree64()
  c.execute(ClipType.Union, FillRule.NonZero, tree)
  return treeToMultiPolygon(tree)
}

/**
 * Union with a closing of `close` database units: every path grown by `close`, the union of the grown paths
 * (Clipper2's offsetting unions its output), then shrunk back by `close` into a polygon tree. Edges meant to
 * coincide that land up to 2·close apart after rounding to the grid (a channel's butt end computed by the
 * offsetter from the rounded centre line against a rotated component's edge rounded on its own) would
 * otherwise leave a one-unit crack between two parts; sizing up and back down is how mask data preparation
 * removes such sub-grid slivers (common practice, no source). Corners within the miter limit come back exactly.
 */
export function closedUnion(paths: Paths64, close: number): MultiPolygon {
  const grow = new ClipperOffset(2)
  grow.addPaths(paths, JoinType.Miter, EndType.Polygon)
  const grown: Paths64 = []
  grow.execute(close, grown)
  const shrink = new ClipperOffset(2)
  shrink.addPaths(grown, JoinType.Miter, EndType.Polygon)
  const tree = new PolyTree64()
  shrink.execute(-close, tree)
  return treeToMultiPolygon(tree)
}

/** Boolean a − b (non-zero fill) as integer paths. */
export function differencePaths(a: Paths64, b: Paths64): Paths64 {
  const c = new Clipper64()
  c.addSubject(a)
  c.addClip(b)
  const out: Paths64 = []
  c.execute(ClipType.Difference, FillRule.NonZero, out)
  return out
}

/** Union (non-zero fill) as integer paths (no tree). */
export function unionFlat(paths: Paths64): Paths64 {
  const c = new Clipper64()
  c.addSubject(paths)
  const out: Paths64 = []
  c.execute(ClipType.Union, FillRule.NonZero, out)
  return out
}

/**
 * Grows (delta > 0) or shrinks (delta < 0) closed integer paths by delta database units with mitred corners
 * (Clipper2's offsetting; a corner sharper than the miter limit is squared off). Miter limit 2 = the
 * classic "sizing" of mask tools with square corners for right angles (√2 < 2).
 */
export function sizePaths(paths: Paths64, delta: number, miterLimit = 2): Paths64 {
  if (delta === 0) return paths
  const o = new ClipperOffset(miterLimit)
  o.addPaths(paths, JoinType.Miter, EndType.Polygon)
  const out: Paths64 = []
  o.execute(delta, out)
  return out
}

/**
 * Fine grid of the stroker: 1 pm (10⁶ per µm). The offsetter takes each segment's direction from its rounded
 * end points; on the 1 nm grid a short, wide segment (11 µm long, 400 µm wide) would tilt its butt-end corners
 * by ~18 nm off the rotated component edge they should meet. Coordinates stay below 2·10¹¹ pm, exact in a double.
 */
export const STROKE_PER_UM = 1e6

/**
 * Sweeps a µm polyline with a half-width (µm): butt ends (the channel ends exactly at its
 * end points), mitred joins up to `miterLimit` × the half-width, squared off beyond — Clipper2's open-path
 * offsetting on the fine grid, rounded to the database grid. Returns the outline as polygons (one, with a hole where the path's ends overlap round a loop).
 */
export function strokeOpenPath(points: readonly Pair[], halfWidth: number, miterLimit: number): MultiPolygon {
  const o = new ClipperOffset(miterLimit)
  o.addPath(toPath(points, STROKE_PER_UM), JoinType.Miter, EndType.Butt)
  const tree = new PolyTree64()
  o.execute(Math.round(halfWidth * STROKE_PER_UM), tree)
  return treeToMultiPolygon(tree, STROKE_PER_UM)
}
