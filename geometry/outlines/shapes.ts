import type { Point } from '#shared/schemas/chip'
import { toWorld } from '#shared/schemas/chip'
import type { Pair, Polygon } from '../types'

/** Axis-aligned rectangle in a local frame, counter-clockwise. */
export const rect = (x0: number, x1: number, y0: number, y1: number): Polygon => [
  [
    [x0, y0],
    [x1, y0],
    [x1, y1],
    [x0, y1],
  ],
]

/** Places a local polygon in the world (rotation in degrees, counter-clockwise, then translation). */
export function place(poly: Polygon, position: Point, rotationDeg: number): Polygon {
  if (rotationDeg === 0) return poly.map(ring => ring.map(([x, y]): Pair => [x + position.x, y + position.y]))
  return poly.map(ring =>
    ring.map(([x, y]): Pair => {
      const w = toWorld({ x, y }, position, rotationDeg)
      return [w.x, w.y]
    }),
  )
}

/** Ring of an annular sector between radii r0 < r1 from angle a0 to a1 (radians), from arc point lists. */
export function annularSector(outer: Pair[], inner: Pair[]): Polygon {
  return [[...outer, ...inner.slice().reverse()]]
}
