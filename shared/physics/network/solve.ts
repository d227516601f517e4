// Solves a hydraulic network: index and check it, assemble the sparse SPD system, solve it, derive flows.
import { NetworkError } from '../errors'
import { assemble, multiply, pressureReference, type ReducedSystem } from './assemble'
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

/** Factors a NetworkResolver keeps, newest first, for solves at conductances it has seen. */
const FACTORS_KEPT = 4

interface Ordering {
  order: Int32Array
  shape: ReturnType<typeof envelopeShape>
}

function ordering(system: ReducedSystem): Ordering {
  const order = reverseCuthillMcKee(system.matrix)
  return { order, shape: envelopeShape(system.matrix, order) }
}

function preconditioner(system: ReducedSystem, known?: Ordering): { apply: Preconditioner; name: SolverName } {
  const { matrix } = system
  const { order, shape } = known ?? ordering(system)
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
      return {
        apply: (r, z) => incompleteSolve(factor, r, z, work),
        name: omega === 0 ? 'pcg-incomplete-cholesky' : 'pcg-modified-incomplete-cholesky',
      }
    }
  }
  return { apply: jacobi(matrix), name: 'pcg-jacobi' }
}

function sameValues(a: Float64Array, b: Float64Array): boolean {
  if (a.length !== b.length) return false
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false
  return true
}

function residualOf(system: ReducedSystem, x: Float64Array): number {
  const ax = new Float64Array(x.length)
  multiply(system.matrix, x, ax)
  let r = 0
  let b = 0
  for (let i = 0; i < x.length; i++) ((r += (system.rhs[i]! - ax[i]!) ** 2), (b += system.rhs[i]! ** 2))
  return b === 0 ? 0 : Math.sqrt(r / b)
}

function finish(
  problem: NetworkProblem,
  net: IndexedNetwork,
  x: Float64Array,
  solver: SolverName,
  iterations: number,
  residual: number,
  sourceIndex?: readonly number[],
): NetworkSolution {
  const n = net.nodeIds.length
  const pressure = new Float64Array(n)
  const reference = pressureReference(net)
  // Flows from pressures relative to the reference, so a large common offset costs no digits.
  const relative = new Float64Array(n)
  for (let i = 0; i < n; i++)
    relative[i] = net.unknownIndex[i]! >= 0 ? x[net.unknownIndex[i]!]! : net.fixedPressure[i]! - reference
  for (let i = 0; i < n; i++) pressure[i] = net.unknownIndex[i]! >= 0 ? relative[i]! + reference : net.fixedPressure[i]!
  const flow = new Float64Array(net.from.length)
  const outflow = new Float64Array(n)
  for (let k = 0; k < flow.length; k++) {
    const q = (relative[net.from[k]!]! - relative[net.to[k]!]! - net.offset[k]!) * net.conductance[k]!
    flow[k] = q
    outflow[net.from[k]!]! += q
    outflow[net.to[k]!]! -= q
  }
  const sources = problem.sources.map((source, k) => {
    const i = sourceIndex ? sourceIndex[k]! : net.nodeIndex.get(source.node)!
    return { node: source.node, pressure: pressure[i]!, flow: 'flow' in source ? source.flow : outflow[i]! }
  })
  return { nodeIds: net.nodeIds, pressure, flow, sources, solver, iterations, residual }
}

/** Sparse solve: PCG preconditioned by the exact envelope Cholesky factor when the envelope is narrow, else by a zero-fill (modified) incomplete Cholesky factor, Jacobi as the last resort. */
export function solveNetwork(problem: NetworkProblem): NetworkSolution {
  const net = indexNetwork(problem)
  const { x, solver, iterations, residual } = solveSystem(assemble(net))
  return finish(problem, net, x, solver, iterations, residual)
}

/** The matrix part of a solve (ordering, factor, PCG) on an assembled system; the benchmark times it against SciPy. */
export function solveSystem(
  system: ReducedSystem,
  known?: Ordering,
  ready?: ReturnType<typeof preconditioner>,
): { x: Float64Array; solver: SolverName; iterations: number; residual: number } {
  const { apply, name } = ready ?? preconditioner(system, known)
  const result = pcg(system.matrix, system.rhs, apply)
  if (!result.converged) {
    throw new NetworkError(
      'not-converged',
      `The network solve stopped at relative residual ${result.residual.toExponential(2)} after ${result.iterations} iterations; check for channels whose resistances differ by more than ~10¹² and merge or drop them`,
    )
  }
  return { x: result.x, solver: name, iterations: result.iterations, residual: result.residual }
}

/** Dense Gaussian elimination on the same system — for the benchmark and cross-checks only. */
export function solveNetworkDense(problem: NetworkProblem): NetworkSolution {
  const net = indexNetwork(problem)
  const system = assemble(net)
  const x = denseSolve(system.matrix, system.rhs)
  return finish(problem, net, x, 'dense-gauss', 0, residualOf(system, x))
}

/**
 * Repeated solves of one network topology at new resistances, offsets and source values (the coupled
 * two-phase iteration, the operating window): indexes the network and orders its matrix once. The sources
 * passed to `solve` must name the same nodes with the same kinds as the problem's.
 */
export class NetworkResolver {
  private readonly net: IndexedNetwork
  private readonly sourceIndex: number[]
  private known?: Ordering
  private readonly factored: { conductance: Float64Array; preconditioner: ReturnType<typeof preconditioner> }[] = []

  constructor(private readonly problem: NetworkProblem) {
    this.net = indexNetwork(problem)
    this.sourceIndex = problem.sources.map(source => this.net.nodeIndex.get(source.node)!)
  }

  solve(
    resistance: ArrayLike<number>,
    offset?: ArrayLike<number>,
    sources: NetworkProblem['sources'] = this.problem.sources,
  ): NetworkSolution {
    const net = this.net
    for (let k = 0; k < net.conductance.length; k++) {
      const r = resistance[k]!
      if (!(r > 0) || !Number.isFinite(r))
        throw new NetworkError(
          'bad-resistance',
          `Channel "${this.problem.channels[k]!.id}" has resistance ${r}; it must be finite and > 0 — check its width, depth and length`,
          { channelIndex: k },
        )
      net.conductance[k] = 1 / r
    }
    if (offset) for (let k = 0; k < net.offset.length; k++) net.offset[k] = offset[k]!
    net.injected.fill(0)
    sources.forEach((source, k) => {
      const i = this.sourceIndex[k]!
      if ('pressure' in source) net.fixedPressure[i] = source.pressure
      else net.injected[i] = net.injected[i]! + source.flow
    })
    const system = assemble(net)
    this.known ??= ordering(system)
    // The matrix depends on the conductances only (sources and offsets move the right-hand side): at the same
    // conductances as a recent solve (the operating window alternates two sets per inlet), its factor is reused.
    let factored = this.factored.find(f => sameValues(f.conductance, net.conductance))
    if (!factored) {
      factored = { conductance: Float64Array.from(net.conductance), preconditioner: preconditioner(system, this.known) }
      this.factored.unshift(factored)
      this.factored.length = Math.min(this.factored.length, FACTORS_KEPT)
    }
    const { x, solver, iterations, residual } = solveSystem(system, this.known, factored.preconditioner)
    return finish({ channels: this.problem.channels, sources }, net, x, solver, iterations, residual, this.sourceIndex)
  }
}
