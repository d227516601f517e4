import { describe, expect, it } from 'vitest'
import { NetworkError } from '#shared/physics/errors'
import {
  flowUniformity,
  pressureMargin,
  solveNetwork,
  solveNetworkDense,
  type NetworkProblem,
} from '#shared/physics/network'
import { assemble } from '#shared/physics/network/assemble'
import { denseSolve } from '#shared/physics/network/dense'
import { incompleteCholesky, incompleteSolve } from '#shared/physics/network/incomplete'
import { indexNetwork } from '#shared/physics/network/indexing'
import { reverseCuthillMcKee } from '#shared/physics/network/ordering'
import { pcg } from '#shared/physics/network/pcg'

function ladder(rungs: number): NetworkProblem {
  const channels = []
  for (let i = 0; i < rungs; i++) {
    channels.push({ id: `feed${i}`, from: `A${i}`, to: `A${i + 1}`, resistance: 1e10 * (1 + (i % 3)) })
    channels.push({ id: `drain${i}`, from: `B${i}`, to: `B${i + 1}`, resistance: 2e10 })
    channels.push({ id: `nozzle${i}`, from: `A${i + 1}`, to: `B${i + 1}`, resistance: 1e13 * (1 + (i % 5) / 10) })
  }
  return {
    channels,
    sources: [
      { node: 'A0', flow: 1e-10 },
      { node: `B${rungs}`, pressure: 0 },
      { node: 'B0', pressure: 50 },
    ],
  }
}

function grid(n: number): NetworkProblem {
  const channels = []
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      if (i + 1 < n)
        channels.push({
          id: `h${i}.${j}`,
          from: `${i}.${j}`,
          to: `${i + 1}.${j}`,
          resistance: 1e9 * (1 + ((7 * i + 3 * j) % 5)),
        })
      if (j + 1 < n)
        channels.push({
          id: `v${i}.${j}`,
          from: `${i}.${j}`,
          to: `${i}.${j + 1}`,
          resistance: 1e9 * (1 + ((3 * i + 5 * j) % 7)),
        })
    }
  return {
    channels,
    sources: [
      { node: '0.0', pressure: 1000 },
      { node: `${n - 1}.${n - 1}`, pressure: 0 },
    ],
  }
}

/** A grid whose every horizontal channel is doubled (parallel duplicates), with flow sources and two outlets. */
function gridWithFlows(n: number): NetworkProblem {
  const base = grid(n)
  const doubled = base.channels
    .filter(c => c.id.startsWith('h'))
    .map(c => ({ ...c, id: `${c.id}'`, resistance: 3 * c.resistance }))
  return {
    channels: [...base.channels, ...doubled],
    sources: [
      { node: '0.0', flow: 1e-9 },
      { node: `${n >> 1}.${n >> 1}`, flow: 2e-9 },
      { node: `${n - 1}.${n - 1}`, pressure: 0 },
      { node: `0.${n - 1}`, pressure: 0 },
    ],
  }
}

const maxRelative = (a: Float64Array, b: Float64Array) => {
  const scale = Math.max(...b.map(Math.abs))
  let worst = 0
  for (let i = 0; i < a.length; i++) worst = Math.max(worst, Math.abs(a[i]! - b[i]!) / scale)
  return worst
}

describe('network solver', () => {
  it('series and parallel by hand: 1 kPa over R + (2R ∥ 2R) gives Q = 1000/(2R) exactly', () => {
    const R = 1e12
    const s = solveNetwork({
      channels: [
        { id: 'a', from: 'in', to: 'mid', resistance: R },
        { id: 'b', from: 'mid', to: 'out', resistance: 2 * R },
        { id: 'c', from: 'mid', to: 'out', resistance: 2 * R },
      ],
      sources: [
        { node: 'in', pressure: 1000 },
        { node: 'out', pressure: 0 },
      ],
    })
    expect(s.flow[0]! / (1000 / (2 * R))).toBeCloseTo(1, 12)
    expect(s.flow[1]! / s.flow[0]!).toBeCloseTo(0.5, 12)
    expect(s.pressure[s.nodeIds.indexOf('mid')]!).toBeCloseTo(500, 9)
    expect(s.sources[0]!.flow).toBeCloseTo(1000 / (2 * R), 20)
  })
  it('a flow source needs pressure Q·R', () => {
    const s = solveNetwork({
      channels: [{ id: 'a', from: 'in', to: 'out', resistance: 3e12 }],
      sources: [
        { node: 'in', flow: 2e-10 },
        { node: 'out', pressure: 0 },
      ],
    })
    expect(s.sources[0]!.pressure).toBeCloseTo(600, 9)
  })
  it.each([
    ['ladder (exact envelope preconditioner)', ladder(200), 'pcg-envelope-cholesky'],
    ['grid 12 × 12', grid(12), 'pcg-envelope-cholesky'],
    ['grid 40 × 40 (modified incomplete Cholesky)', grid(40), 'pcg-modified-incomplete-cholesky'],
    ['grid 45 × 45 with flow sources and doubled channels', gridWithFlows(45), 'pcg-modified-incomplete-cholesky'],
  ])('sparse PCG agrees with dense Gaussian elimination to 1e-9 relative: %s', (_, problem, solver) => {
    const sparse = solveNetwork(problem)
    const dense = solveNetworkDense(problem)
    expect(sparse.solver).toBe(solver)
    expect(maxRelative(sparse.pressure, dense.pressure)).toBeLessThan(1e-9)
    expect(maxRelative(sparse.flow, dense.flow)).toBeLessThan(1e-9)
  })
  it('IC(0) and MIC(0) both reach the dense answer on a grid; MIC needs fewer iterations (Gustafsson 1978)', () => {
    const { matrix, rhs } = assemble(indexNetwork(gridWithFlows(45)))
    const order = reverseCuthillMcKee(matrix)
    const exact = denseSolve(matrix, rhs)
    const iterations = [0, 0.99].map(omega => {
      const factor = incompleteCholesky(matrix, order, omega)!
      const work = new Float64Array(matrix.size)
      const result = pcg(matrix, rhs, (r, z) => incompleteSolve(factor, r, z, work))
      expect(result.converged).toBe(true)
      expect(maxRelative(result.x, exact)).toBeLessThan(1e-9)
      return result.iterations
    })
    expect(iterations[1]!).toBeLessThan(iterations[0]!)
  })
  it('a zero-fill factor of a tree is its exact Cholesky factor: PCG converges in one step', () => {
    const channels = Array.from({ length: 300 }, (_, k) => ({
      id: `t${k}`,
      from: `n${Math.floor(k / 2)}`,
      to: `n${k + 1}`,
      resistance: 1e10 * (1 + (k % 4)),
    }))
    const { matrix, rhs } = assemble(
      indexNetwork({
        channels,
        sources: [
          { node: 'n0', pressure: 100 },
          ...Array.from({ length: 10 }, (_, k) => ({ node: `n${290 + k}`, flow: -1e-12 })),
        ],
      }),
    )
    const factor = incompleteCholesky(matrix, reverseCuthillMcKee(matrix), 0)!
    const work = new Float64Array(matrix.size)
    const result = pcg(matrix, rhs, (r, z) => incompleteSolve(factor, r, z, work))
    expect(result.iterations).toBe(1)
    expect(maxRelative(result.x, denseSolve(matrix, rhs))).toBeLessThan(1e-12)
  })
  it('conserves flow at every free node', () => {
    const problem = ladder(50)
    const s = solveNetwork(problem)
    const net = new Map<string, number>()
    problem.channels.forEach((c, k) => {
      net.set(c.from, (net.get(c.from) ?? 0) - s.flow[k]!)
      net.set(c.to, (net.get(c.to) ?? 0) + s.flow[k]!)
    })
    for (const [node, q] of net) if (!['A0', 'B0', 'B50'].includes(node)) expect(Math.abs(q)).toBeLessThan(1e-22)
  })
  it('scaling every resistance by k scales pressures by k at fixed flow (invariant)', () => {
    const base = solveNetwork(ladder(20))
    const scaled = ladder(20)
    const k = 8
    const problem = {
      channels: scaled.channels.map(c => ({ ...c, resistance: c.resistance * k })),
      sources: [
        { node: 'A0', flow: 1e-10 },
        { node: 'B20', pressure: 0 },
        { node: 'B0', pressure: 50 * k },
      ],
    }
    const s = solveNetwork(problem)
    for (let i = 0; i < s.pressure.length; i++)
      expect(s.pressure[i]! / (base.pressure[i]! * k || 1)).toBeCloseTo(base.pressure[i] === 0 ? 0 : 1, 9)
  })
})

describe('network errors name the fix', () => {
  const channel = (id: string, from: string, to: string) => ({ id, from, to, resistance: 1e12 })
  const expectError = (problem: NetworkProblem, code: string, pattern: RegExp) => {
    try {
      solveNetwork(problem)
      expect.unreachable('should have thrown')
    } catch (error) {
      expect(error).toBeInstanceOf(NetworkError)
      expect((error as NetworkError).code).toBe(code)
      expect((error as Error).message).toMatch(pattern)
    }
  }
  it('floating sub-network lists its nodes', () => {
    expectError(
      {
        channels: [channel('a', 'in', 'out'), channel('b', 'x', 'y')],
        sources: [
          { node: 'in', flow: 1e-10 },
          { node: 'out', pressure: 0 },
        ],
      },
      'floating',
      /"x", "y"/,
    )
  })
  it('flow-only network is floating', () => {
    expectError(
      { channels: [channel('a', 'in', 'out')], sources: [{ node: 'in', flow: 1e-10 }] },
      'floating',
      /pressure source/,
    )
  })
  it('two pressure sources on one node, or a flow source on a pressure node, are over-constrained', () => {
    expectError(
      {
        channels: [channel('a', 'in', 'out')],
        sources: [
          { node: 'in', pressure: 1 },
          { node: 'in', pressure: 2 },
        ],
      },
      'over-constrained',
      /"in"/,
    )
    expectError(
      {
        channels: [channel('a', 'in', 'out')],
        sources: [
          { node: 'out', pressure: 0 },
          { node: 'out', flow: 1e-9 },
        ],
      },
      'over-constrained',
      /"out"/,
    )
  })
  it('unknown node ids and bad resistances', () => {
    expectError(
      { channels: [channel('a', 'in', 'out')], sources: [{ node: 'nowhere', pressure: 0 }] },
      'unknown-node',
      /"nowhere"/,
    )
    expectError(
      { channels: [{ id: 'a', from: 'in', to: 'out', resistance: 0 }], sources: [{ node: 'out', pressure: 0 }] },
      'bad-resistance',
      /"a"/,
    )
    expectError(
      {
        channels: [{ id: 'a', from: 'in', to: 'out', resistance: Number.NaN }],
        sources: [{ node: 'out', pressure: 0 }],
      },
      'bad-resistance',
      /"a"/,
    )
  })
})

describe('pressure budget', () => {
  it('uniformity of equal flows is CV 0 and max/min 1; margins subtract the highest inlet', () => {
    expect(flowUniformity([1, 1, 1])).toMatchObject({ cv: 0, maxOverMin: 1 })
    expect(flowUniformity([1, 3]).cv).toBeCloseTo(0.5, 12)
    expect(pressureMargin(1000, [200, 700])).toMatchObject({ margin: 300, ok: true })
    expect(pressureMargin(500, [700]).ok).toBe(false)
  })
})
