import Flatbush from 'flatbush'
import type { MultiPolygon, Pair } from '../types'

/** Edges of merged outlines, flattened for the spatial index. Interior is left of every edge (CCW/CW rings). */
export interface EdgeSet {
  ax: Float64Array
  ay: Float64Array
  bx: Float64Array
  by: Float64Array
  /** Which polygon (separate part) of the layer an edge belongs to. */
  part: Int32Array
  /** Ring id (unique per ring) and index inside the ring, to skip neighbouring edges. */
  ring: Int32Array
  index: Int32Array
  ringLength: Int32Array
  count: number
}

export function collectEdges(mp: MultiPolygon): EdgeSet {
  let n = 0
  for (const poly of mp) for (const ring of poly) n += ringEdges(ring)
  const e: EdgeSet = {
    ax: new Float64Array(n),
    ay: new Float64Array(n),
    bx: new Float64Array(n),
    by: new Float64Array(n),
    part: new Int32Array(n),
    ring: new Int32Array(n),
    index: new Int32Array(n),
    ringLength: new Int32Array(n),
    count: n,
  }
  let k = 0
  let ringId = 0
  mp.forEach((poly, partId) => {
    for (const ring of poly) {
      const m = ringEdges(ring)
      for (let i = 0; i < m; i++) {
        const a = ring[i]!
        const b = ring[(i + 1) % ring.length]!
        e.ax[k] = a[0]
        e.ay[k] = a[1]
        e.bx[k] = b[0]
        e.by[k] = b[1]
        e.part[k] = partId
        e.ring[k] = ringId
        e.index[k] = i
        e.ringLength[k] = m
        k++
      }
      ringId++
    }
  })
  return e
}

/** polygon-clipping closes rings by repeating the first point; count edges without the repeat. */
function ringEdges(ring: Pair[]): number {
  const f = ring[0]
  const l = ring[ring.length - 1]
  const closed = ring.length > 1 && f && l && f[0] === l[0] && f[1] === l[1]
  return closed ? ring.length - 1 : ring.length
}

/** Flatbush R-tree over the edge boxes (Agafonkin, flatbush: packed Hilbert R-tree). */
export function indexEdges(e: EdgeSet): Flatbush | null {
  if (e.count === 0) return null
  const idx = new Flatbush(e.count)
  for (let i = 0; i < e.count; i++) {
    idx.add(
      Math.min(e.ax[i]!, e.bx[i]!),
      Math.min(e.ay[i]!, e.by[i]!),
      Math.max(e.ax[i]!, e.bx[i]!),
      Math.max(e.ay[i]!, e.by[i]!),
    )
  }
  idx.finish()
  return idx
}

/** True when edges i and j are neighbours in the same ring (share a vertex). */
export function adjacent(e: EdgeSet, i: number, j: number): boolean {
  if (e.ring[i] !== e.ring[j]) return false
  const n = e.ringLength[i]!
  const d = Math.abs(e.index[i]! - e.index[j]!)
  return d <= 1 || d === n - 1
}
