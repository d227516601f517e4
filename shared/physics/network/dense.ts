// Dense Gaussian elimination with partial pivoting (Golub & Van Loan 2013, Matrix Computations, alg. 3.4.1).
// Used only by the benchmark and as a cross-check in tests: O(n²) memory, O(n³) time.
import type { CsrMatrix } from './assemble'

export function denseSolve(matrix: CsrMatrix, rhs: Float64Array): Float64Array {
  const n = matrix.size
  const a = new Float64Array(n * n)
  for (let i = 0; i < n; i++) {
    a[i * n + i] = matrix.diagonal[i]!
    for (let e = matrix.rowStart[i]!; e < matrix.rowStart[i + 1]!; e++)
      a[i * n + matrix.column[e]!]! += matrix.value[e]!
  }
  const b = Float64Array.from(rhs)
  for (let k = 0; k < n; k++) {
    let pivot = k
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i * n + k]!) > Math.abs(a[pivot * n + k]!)) pivot = i
    if (pivot !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j]!
        a[k * n + j] = a[pivot * n + j]!
        a[pivot * n + j] = t
      }
      const t = b[k]!
      b[k] = b[pivot]!
      b[pivot] = t
    }
    const d = a[k * n + k]!
    for (let i = k + 1; i < n; i++) {
      const f = a[i * n + k]! / d
      if (f === 0) continue
      for (let j = k; j < n; j++) a[i * n + j]! -= f * a[k * n + j]!
      b[i]! -= f * b[k]!
    }
  }
  const x = new Float64Array(n)
  for (let i = n - 1; i >= 0; i--) {
    let sum = b[i]!
    for (let j = i + 1; j < n; j++) sum -= a[i * n + j]! * x[j]!
    x[i] = sum / a[i * n + i]!
  }
  return x
}
