import type { Point } from './primitives'

/**
 * Rigid placement of a component: rotate a local point by `rotationDeg` counter-clockwise about the origin,
 * then translate by `position` (the 2D rotation matrix [cos −sin; sin cos], elementary linear algebra).
 */
export function toWorld(local: Point, position: Point, rotationDeg: number): Point {
  const a = (rotationDeg * Math.PI) / 180
  const c = Math.cos(a)
  const s = Math.sin(a)
  return { x: position.x + c * local.x - s * local.y, y: position.y + s * local.x + c * local.y }
}

/** Rotate a direction (no translation). */
export function rotateDirection(d: Point, rotationDeg: number): Point {
  return toWorld(d, { x: 0, y: 0 }, rotationDeg)
}
