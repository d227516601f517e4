// Solves a hydraulic network: index and check it, assemble the sparse SPD system, solve it, derive flows.
import { NetworkError } from '../errors'
import { assemble, multiply, type ReducedSystem } from './assemble'
import { denseSolve } from './dense'
import { envelopeCholesky, envelopeShape, envelopeSolve } from './envelope'
import { indexNetwork, type IndexedNetwork } from './indexing'
import { reverseCuthillMcKee } from './ordering'
import { incompleteCholesky, incompleteSolve } from './incomplete'
import { jacobi, pcg, type Preconditioner } from './pcg'
import type { NetworkProblem, NetworkSolution, SolverName } from './types'

/** Use the exact envelope factor as preconditioner while its cost stays within this many flops per unknown. */
const ENVELOPE_COST_PER_UNKNOWN = 600
/**
 * Relaxation of the modified incomplete Cholesky: 0.99 took the fewest iterations on our benchmark grids
 * (1k–100k channels; 1 and 0.95 within 25 %), measured here, not from a source.
 */
const MIC_RELAXATION = 0.99

function preconditioner(system: ReducedSystem): { apply: Preconditioner; name: SolverName } {
  const { matrix } = system
  const order = reverseCuthillMcKee(matrix)
  const shape = envelopeShape(matrix, order)
  if (shape.cost <= ENVELOPE_COST_PER_UNKNOWN * Math.max(matrix.size, 1)) {
    const factor = envelopeCholesky(matrix, order, shape.first, shape.entries)
    if (factor) {
      const work = new Float64Array(matrix.size)
      return { apply: (r, z) => envelopeSolve(factor, r, z, work), name: 'pcg-envelope-cholesky' }
    }
  }
  // Wide networks (2-D grids): zero-fill incomplete Cholesky — modified first, plain IC(0) if a pivot collapses.
  for (const omega of [MIC_RELAXATION, 0]) {
    const factor = incompleteCholesky(matrix, order, omega)
    if (factor) {
      const work = new Float64Array(matrix.size)
      return { apply: (r, z) => incompleteSolve(factor, r, z, work), name: omega === 0 ? 'pcg-incomplete-cholesky' : 'pcg-modified-incomplete-cholesky' }
    }
  }
  return { apply: jacobi(matrix), name: 'pcg-jacobi' }
}

function residualOf(system: ReducedSystem, x: Float64Array): number {
  const ax = new Float64Array(x.length)
  multiply(system.matrix, x, ax)
  let r = 0
  let b = 0
  for (let i = 0; i < x.length; i++) ((r += (system.rhs[i]! - ax[i]!) ** 2), (b += system.rhs[i]! ** 2))
  return b === 0 ? 0 : Math.sqrt(r / b)
}

function finish(problem: NetworkProblem, net: IndexedNetwork, x: Float64Array, solver: SolverName, iterations: number, residual: number): NetworkSolution {
  const n = net.nodeIds.length
  const pressure = new Float64Array(n)
  for (let i = 0; i < n; i++) pressure[i] = net.unknownIndex[i]! >= 0 ? x[net.unknownIndex[i]!]! : net.fixedPressure[i]!
  const flow = new Float64Array(net.from.length)
  const outflow = new Float64Array(n)
  for (let k = 0; k < flow.length; k++) {
    const q = (pressure[net.from[k]!]! - pressure[net.to[k]!]! - net.offset[k]!) * net.conductance[k]!
    flow[k] = q
    outflow[net.from[k]!]! += q
    outflow[net.to[k]!]! -= q
  }
  const index = new Map(net.nodeIds.map((id, i) => [id, i]))
  const sources = problem.sources.map((source) => {
    const i = index.get(source.node)!
    return { node: source.node, pressure: pressure[i]!, flow: 'flow' in source ? source.flow : outflow[i]! }
  })
  return { nodeIds: net.nodeIds, pressure, flow, sources, solver, iterations, residual }
}

/** Sparse solve: PCG preconditioned by the exact envelope Cholesky factor when the envelope is narrow, else by a zero-fill (modified) incomplete Cholesky factor, Jacobi as the last resort. */
export function solveNetwork(problem: NetworkProblem): NetworkSolution {
  const net = indexNetwork(problem)
  const system = assemble(net)
  const { apply, name } = preconditioner(system)
  const result = pcg(system.matrix, system.rhs, apply)
  if (!result.converged) {
    throw new NetworkError('not-converged', `The network solve stopped at relative residual ${result.residual.toExponential(2)} after ${result.iterations} iterations; check for channels whose resistances differ by more than ~10¹² and merge or drop them`)
  }
  return finish(problem, net, result.x, name, result.iterations, result.residual)
}

/** Dense Gaussian elimination on the same system — for the benchmark and cross-checks only. */
export function solveNetworkDense(problem: NetworkProblem): NetworkSolution {
  const net = indexNetwork(problem)
  const system = assemble(net)
  const x = denseSolve(system.matrix, system.rhs)
  return finish(problem, net, x, 'dense-gauss', 0, residualOf(system, x))
}
