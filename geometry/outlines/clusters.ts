import Flatbush from 'flatbush'
import type { Polygon } from '../types'

/** Bounding box of a piece's exterior ring (holes lie inside it): [minX, minY, maxX, maxY]. */
export type Box = [number, number, number, number]

export function pieceBox(p: Polygon): Box {
  let x0 = Infinity
  let y0 = Infinity
  let x1 = -Infinity
  let y1 = -Infinity
  for (const [x, y] of p[0] ?? []) {
    if (x < x0) x0 = x
    if (y < y0) y0 = y
    if (x > x1) x1 = x
    if (y > y1) y1 = y
  }
  return [x0, y0, x1, y1]
}

/**
 * Groups pieces whose bounding boxes overlap or come within `margin` of each other, transitively: the
 * connected components of the box-overlap graph (flatbush box queries, then union–find with path halving and
 * union by index). Pieces in different groups cannot touch, so each group can be merged on its own and the
 * results simply collected — a piece inside another group's hole stays a separate island, as in one union.
 * O(n log n + k) for k overlapping box pairs. Groups and their members keep input order. `known`: the pieces'
 * boxes when the caller has them (e.g. snapped to the grid).
 */
export function pieceClusters(pieces: readonly Polygon[], margin: number, known?: readonly Box[]): number[][] {
  const n = pieces.length
  if (n === 0) return []
  const boxes = known ?? pieces.map(pieceBox)
  const index = new Flatbush(n)
  for (const [x0, y0, x1, y1] of boxes) index.add(x0, y0, x1, y1)
  index.finish()

  const parent = new Int32Array(n)
  for (let i = 0; i < n; i++) parent[i] = i
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]!]!
      i = parent[i]!
    }
    return i
  }
  for (let i = 0; i < n; i++) {
    const [x0, y0, x1, y1] = boxes[i]!
    for (const j of index.search(x0 - margin, y0 - margin, x1 + margin, y1 + margin)) {
      if (j <= i) continue
      const a = find(i)
      const b = find(j)
      if (a !== b) parent[Math.max(a, b)] = Math.min(a, b)
    }
  }
  const groups = new Map<number, number[]>()
  for (let i = 0; i < n; i++) {
    const r = find(i)
    const g = groups.get(r)
    if (g) g.push(i)
    else groups.set(r, [i])
  }
  return [...groups.values()]
}
