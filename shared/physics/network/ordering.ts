// Reverse Cuthill–McKee ordering (Cuthill & McKee 1969, Proc. 24th ACM National Conference, 157–172;
// reversal by George 1971): a breadth-first numbering that keeps a network's envelope narrow, so ladders
// and nozzle arrays factor exactly in linear time.
import type { CsrMatrix } from './assemble'

/** Returns order[newIndex] = oldIndex. */
export function reverseCuthillMcKee(matrix: CsrMatrix): Int32Array {
  const { size, rowStart, column } = matrix
  const order = new Int32Array(size)
  const seen = new Uint8Array(size)
  let tail = 0
  const degree = (i: number) => rowStart[i + 1]! - rowStart[i]!
  const bfs = (start: number, record: boolean): number => {
    // Breadth-first from `start`; returns the last node reached (a far node). Uses `order` as the queue.
    const begin = tail
    seen[start] = 1
    order[tail++] = start
    let head = begin
    let last = start
    while (head < tail) {
      const i = order[head++]!
      last = i
      const first = tail
      for (let e = rowStart[i]!; e < rowStart[i + 1]!; e++) {
        const j = column[e]!
        if (!seen[j]) ((seen[j] = 1), (order[tail++] = j))
      }
      if (record) sortByDegree(order, first, tail, degree)
    }
    if (!record) {
      for (let k = begin; k < tail; k++) seen[order[k]!] = 0
      tail = begin
    }
    return last
  }
  for (let s = 0; s < size; s++) {
    if (seen[s]) continue
    const far = bfs(s, false) // one sweep towards a pseudo-peripheral start node
    bfs(far, true)
  }
  order.reverse()
  return order
}

function sortByDegree(order: Int32Array, from: number, to: number, degree: (i: number) => number): void {
  for (let a = from + 1; a < to; a++) {
    const node = order[a]!
    const d = degree(node)
    let b = a - 1
    while (b >= from && degree(order[b]!) > d) ((order[b + 1] = order[b]!), b--)
    order[b + 1] = node
  }
}
