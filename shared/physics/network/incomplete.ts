// Zero-fill incomplete Cholesky A ≈ L D Lᵀ on A's own sparsity pattern, in the RCM order, as a PCG
// preconditioner for networks whose exact factor would fill in (wide 2-D grids).
//   IC(0): fill outside the pattern is dropped (Meijerink & van der Vorst 1977, Math. Comp. 31, 148–162; exists
//   for every M-matrix, which a grounded Kirchhoff matrix with positive conductances is).
//   Modified IC (MIC(0)): dropped fill is added to the diagonal so row sums are kept (Gustafsson 1978, BIT 18,
//   142–156), which lowers the condition number of a 2-D grid from O(h⁻²) to O(h⁻¹); relaxed by ω < 1
//   against near-zero pivots (Axelsson 1994, Iterative Solution Methods, ch. 7).
// RCM numbering is as good as the natural one for IC(0) (Duff & Meurant 1989, BIT 29, 635–657).
import type { CsrMatrix } from './assemble'

export interface IncompleteFactor {
  order: Int32Array
  /** Strictly lower part of L by columns (new numbering): rows of column k are row[colStart[k]..colStart[k+1]). */
  colStart: Int32Array
  row: Int32Array
  value: Float64Array
  /** D. */
  pivot: Float64Array
}

/** L's pattern = A's strictly lower pattern in the new order; parallel channels' duplicate entries merged. */
function lowerPattern(
  matrix: CsrMatrix,
  order: Int32Array,
): { colStart: Int32Array; row: Int32Array; value: Float64Array } {
  const n = matrix.size
  const position = new Int32Array(n)
  for (let k = 0; k < n; k++) position[order[k]!] = k
  const count = new Int32Array(n + 1)
  for (let old = 0; old < n; old++) {
    const i = position[old]!
    for (let e = matrix.rowStart[old]!; e < matrix.rowStart[old + 1]!; e++) {
      const j = position[matrix.column[e]!]!
      if (j < i) count[j + 1]!++
    }
  }
  for (let k = 0; k < n; k++) count[k + 1]! += count[k]!
  const fill = count.slice(0, n)
  const row = new Int32Array(count[n]!)
  const value = new Float64Array(count[n]!)
  for (let old = 0; old < n; old++) {
    const i = position[old]!
    for (let e = matrix.rowStart[old]!; e < matrix.rowStart[old + 1]!; e++) {
      const j = position[matrix.column[e]!]!
      if (j < i) ((row[fill[j]!] = i), (value[fill[j]!++] = matrix.value[e]!))
    }
  }
  // Sort each column by row and merge duplicates (a few entries per column: insertion sort).
  const colStart = new Int32Array(n + 1)
  let out = 0
  for (let k = 0; k < n; k++) {
    const begin = count[k]!
    const end = count[k + 1]!
    for (let a = begin + 1; a < end; a++) {
      const r = row[a]!
      const v = value[a]!
      let b = a - 1
      while (b >= begin && row[b]! > r) ((row[b + 1] = row[b]!), (value[b + 1] = value[b]!), b--)
      ;((row[b + 1] = r), (value[b + 1] = v))
    }
    colStart[k] = out
    for (let a = begin; a < end; a++) {
      if (out > colStart[k]! && row[out - 1] === row[a]) value[out - 1]! += value[a]!
      else ((row[out] = row[a]!), (value[out++] = value[a]!))
    }
  }
  colStart[n] = out
  return { colStart, row: row.subarray(0, out), value: value.subarray(0, out) }
}

/**
 * Factorises with relaxation ω (0 = IC(0), 1 = MIC(0)). Returns null if a pivot falls to ≤ `minPivot` × its
 * original diagonal, so the caller can retry with a smaller ω.
 */
export function incompleteCholesky(
  matrix: CsrMatrix,
  order: Int32Array,
  omega: number,
  minPivot = 1e-8,
): IncompleteFactor | null {
  const n = matrix.size
  const { colStart, row, value } = lowerPattern(matrix, order)
  const pivot = new Float64Array(n)
  for (let k = 0; k < n; k++) pivot[k] = matrix.diagonal[order[k]!]!
  const original = Float64Array.from(pivot)
  for (let k = 0; k < n; k++) {
    const dk = pivot[k]!
    if (!(dk > minPivot * original[k]!)) return null
    const begin = colStart[k]!
    const end = colStart[k + 1]!
    for (let e = begin; e < end; e++) value[e]! /= dk
    for (let e1 = begin; e1 < end; e1++) {
      const i = row[e1]!
      const li = value[e1]! * dk
      pivot[i]! -= li * value[e1]!
      for (let e2 = begin; e2 < e1; e2++) {
        // Update of entry (i, j), j = row[e2] < i: in column j if the pattern has it, else dropped fill.
        const j = row[e2]!
        const update = li * value[e2]!
        let found = -1
        for (let f = colStart[j]!; f < colStart[j + 1]!; f++) if (row[f] === i) ((found = f), (f = colStart[j + 1]!))
        if (found >= 0) value[found]! -= update
        else if (omega !== 0) ((pivot[i]! -= omega * update), (pivot[j]! -= omega * update))
      }
    }
  }
  return { order, colStart, row, value, pivot }
}

/** Solves L D Lᵀ z = r (r, z in the original numbering); `work` has the matrix size. */
export function incompleteSolve(factor: IncompleteFactor, r: Float64Array, z: Float64Array, work: Float64Array): void {
  const { order, colStart, row, value, pivot } = factor
  const n = order.length
  for (let k = 0; k < n; k++) work[k] = r[order[k]!]!
  for (let k = 0; k < n; k++) {
    const yk = work[k]!
    for (let e = colStart[k]!; e < colStart[k + 1]!; e++) work[row[e]!]! -= value[e]! * yk
  }
  for (let k = 0; k < n; k++) work[k]! /= pivot[k]!
  for (let k = n - 1; k >= 0; k--) {
    let s = work[k]!
    for (let e = colStart[k]!; e < colStart[k + 1]!; e++) s -= value[e]! * work[row[e]!]!
    work[k] = s
  }
  for (let k = 0; k < n; k++) z[order[k]!] = work[k]!
}
