// Kirchhoff's current law on the unknown pressures: A p = b, A the weighted graph Laplacian restricted to
// unknown nodes (sparse, symmetric positive definite once every node is grounded), stored as CSR.
import type { IndexedNetwork } from './indexing'

export interface CsrMatrix {
  size: number
  rowStart: Int32Array
  column: Int32Array
  value: Float64Array
  diagonal: Float64Array
}

export interface ReducedSystem {
  matrix: CsrMatrix
  rhs: Float64Array
}

/** Assembles A and b. Off-diagonal entries of parallel channels stay as duplicates (harmless for A·x). */
export function assemble(net: IndexedNetwork): ReducedSystem {
  const size = net.unknownCount
  const diagonal = new Float64Array(size)
  const rhs = new Float64Array(size)
  const count = new Int32Array(size + 1)
  const channels = net.from.length
  for (let k = 0; k < channels; k++) {
    const i = net.unknownIndex[net.from[k]!]!
    const j = net.unknownIndex[net.to[k]!]!
    if (i >= 0 && j >= 0) ((count[i + 1]! += 1), (count[j + 1]! += 1))
  }
  for (let r = 0; r < size; r++) count[r + 1]! += count[r]!
  const rowStart = count
  const fill = rowStart.slice(0, size)
  const column = new Int32Array(rowStart[size]!)
  const value = new Float64Array(rowStart[size]!)
  for (let k = 0; k < channels; k++) {
    const a = net.from[k]!
    const b = net.to[k]!
    const i = net.unknownIndex[a]!
    const j = net.unknownIndex[b]!
    const g = net.conductance[k]!
    if (i >= 0) diagonal[i]! += g
    if (j >= 0) diagonal[j]! += g
    if (i >= 0 && j >= 0) {
      column[fill[i]!] = j
      value[fill[i]!++] = -g
      column[fill[j]!] = i
      value[fill[j]!++] = -g
    } else if (i >= 0) rhs[i]! += g * net.fixedPressure[b]!
    else if (j >= 0) rhs[j]! += g * net.fixedPressure[a]!
    // A pressure offset Δ: outflow g (p_from − p_to − Δ), so g·Δ moves to the right-hand side at `from`, −g·Δ at `to`.
    const d = net.offset[k]!
    if (d !== 0) {
      if (i >= 0) rhs[i]! += g * d
      if (j >= 0) rhs[j]! -= g * d
    }
  }
  for (let node = 0; node < net.nodeIds.length; node++) {
    const i = net.unknownIndex[node]!
    if (i >= 0) rhs[i]! += net.injected[node]!
  }
  return { matrix: { size, rowStart, column, value, diagonal }, rhs }
}

/** y = A x. */
export function multiply(matrix: CsrMatrix, x: Float64Array, y: Float64Array): void {
  const { size, rowStart, column, value, diagonal } = matrix
  for (let i = 0; i < size; i++) {
    let sum = diagonal[i]! * x[i]!
    for (let e = rowStart[i]!; e < rowStart[i + 1]!; e++) sum += value[e]! * x[column[e]!]!
    y[i] = sum
  }
}
