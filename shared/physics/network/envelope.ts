// Envelope (profile) Cholesky factorisation A = L Lᵀ in the RCM order (Jennings 1966, Comput. J. 9, 281;
// George & Liu 1981, Computer Solution of Large Sparse Positive Definite Systems, ch. 4). Exact; its cost is
// Σ(row envelope width)², linear for networks of bounded bandwidth such as ladders and nozzle arrays.
import type { CsrMatrix } from './assemble'

export interface EnvelopeFactor {
  order: Int32Array
  /** first[i]: first column of row i's envelope, in the new numbering. */
  first: Int32Array
  /** Row i's entries for columns first[i]..i start at offset[i]. */
  offset: Int32Array
  values: Float64Array
}

/** Envelope width per row after reordering, and the factor's cost Σ width². */
export function envelopeShape(
  matrix: CsrMatrix,
  order: Int32Array,
): { first: Int32Array; entries: number; cost: number } {
  const size = matrix.size
  const position = new Int32Array(size)
  for (let k = 0; k < size; k++) position[order[k]!] = k
  const first = new Int32Array(size)
  let entries = 0
  let cost = 0
  for (let k = 0; k < size; k++) {
    const old = order[k]!
    let low = k
    for (let e = matrix.rowStart[old]!; e < matrix.rowStart[old + 1]!; e++)
      low = Math.min(low, position[matrix.column[e]!]!)
    first[k] = low
    entries += k - low + 1
    cost += (k - low + 1) ** 2
  }
  return { first, entries, cost }
}

/** Factorises; returns null if a pivot is not positive (cannot happen for a grounded network, kept as a guard). */
export function envelopeCholesky(
  matrix: CsrMatrix,
  order: Int32Array,
  first: Int32Array,
  entries: number,
): EnvelopeFactor | null {
  const size = matrix.size
  const offset = new Int32Array(size + 1)
  for (let k = 0; k < size; k++) offset[k + 1] = offset[k]! + (k - first[k]! + 1)
  const values = new Float64Array(entries)
  const position = new Int32Array(size)
  for (let k = 0; k < size; k++) position[order[k]!] = k
  for (let k = 0; k < size; k++) {
    const old = order[k]!
    values[offset[k]! + k - first[k]!] = matrix.diagonal[old]!
    for (let e = matrix.rowStart[old]!; e < matrix.rowStart[old + 1]!; e++) {
      const c = position[matrix.column[e]!]!
      if (c < k) values[offset[k]! + c - first[k]!]! += matrix.value[e]!
    }
  }
  for (let i = 0; i < size; i++) {
    const fi = first[i]!
    const oi = offset[i]! - fi
    for (let j = fi; j <= i; j++) {
      const fj = first[j]!
      const oj = offset[j]! - fj
      let sum = values[oi + j]!
      for (let k = Math.max(fi, fj); k < j; k++) sum -= values[oi + k]! * values[oj + k]!
      if (j < i) values[oi + j] = sum / values[oj + j]!
      else {
        if (!(sum > 0)) return null
        values[oi + i] = Math.sqrt(sum)
      }
    }
  }
  return { order, first, offset, values }
}

/** Solves L Lᵀ z = r (r, z in the original numbering); `work` has the matrix size. */
export function envelopeSolve(factor: EnvelopeFactor, r: Float64Array, z: Float64Array, work: Float64Array): void {
  const { order, first, offset, values } = factor
  const size = order.length
  for (let i = 0; i < size; i++) {
    const oi = offset[i]! - first[i]!
    let sum = r[order[i]!]!
    for (let k = first[i]!; k < i; k++) sum -= values[oi + k]! * work[k]!
    work[i] = sum / values[oi + i]!
  }
  for (let i = size - 1; i >= 0; i--) {
    const oi = offset[i]! - first[i]!
    const xi = work[i]! / values[oi + i]!
    work[i] = xi
    for (let k = first[i]!; k < i; k++) work[k]! -= values[oi + k]! * xi
  }
  for (let i = 0; i < size; i++) z[order[i]!] = work[i]!
}
