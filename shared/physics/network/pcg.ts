// Preconditioned conjugate gradient (Hestenes & Stiefel 1952, J. Res. NBS 49, 409; Saad 2003, Iterative
// Methods for Sparse Linear Systems, alg. 9.1) on the SPD Kirchhoff system.
import { multiply, type CsrMatrix } from './assemble'

export type Preconditioner = (r: Float64Array, z: Float64Array) => void

export interface PcgResult {
  x: Float64Array
  iterations: number
  residual: number
  converged: boolean
}

export function jacobi(matrix: CsrMatrix): Preconditioner {
  const inverse = matrix.diagonal.map(d => 1 / d)
  return (r, z) => {
    for (let i = 0; i < r.length; i++) z[i] = r[i]! * inverse[i]!
  }
}

const dot = (a: Float64Array, b: Float64Array): number => {
  let sum = 0
  for (let i = 0; i < a.length; i++) sum += a[i]! * b[i]!
  return sum
}

/** Solves A x = b to ‖b − Ax‖ ≤ tolerance·‖b‖. */
export function pcg(
  matrix: CsrMatrix,
  b: Float64Array,
  precondition: Preconditioner,
  tolerance = 1e-13,
  maxIterations = 10 * b.length + 100,
): PcgResult {
  const n = b.length
  const x = new Float64Array(n)
  const r = Float64Array.from(b)
  const z = new Float64Array(n)
  const p = new Float64Array(n)
  const q = new Float64Array(n)
  const norm = Math.sqrt(dot(b, b))
  if (norm === 0) return { x, iterations: 0, residual: 0, converged: true }
  precondition(r, z)
  p.set(z)
  let rz = dot(r, z)
  let residual = 1
  let iteration = 0
  while (iteration < maxIterations) {
    multiply(matrix, p, q)
    const step = rz / dot(p, q)
    for (let i = 0; i < n; i++) {
      x[i]! += step * p[i]!
      r[i]! -= step * q[i]!
    }
    iteration++
    residual = Math.sqrt(dot(r, r)) / norm
    if (residual <= tolerance) break
    precondition(r, z)
    const next = dot(r, z)
    const beta = next / rz
    rz = next
    for (let i = 0; i < n; i++) p[i] = z[i]! + beta * p[i]!
  }
  return { x, iterations: iteration, residual, converged: residual <= tolerance }
}
