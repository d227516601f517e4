import type { MultiPolygon } from './types'
import { signedArea } from './vec'

/** Area of a merged multipolygon in µm²: exteriors minus holes (shoelace formula on each ring). */
export function multiPolygonArea(mp: MultiPolygon): number {
  let a = 0
  for (const poly of mp)
    poly.forEach((ring, i) => {
      a += i === 0 ? Math.abs(signedArea(ring)) : -Math.abs(signedArea(ring))
    })
  return a
}
