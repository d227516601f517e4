// NetworkResolver keeps the factors of recent conductance sets: a solve at conductances it has seen must give
// exactly (bit for bit) what a fresh resolver gives, and new conductances must never reuse an old factor.
import { describe, expect, it } from 'vitest'
import { NetworkResolver, type NetworkProblem } from '#shared/physics/network'

function ladder(rungs: number): NetworkProblem {
  const channels = []
  for (let i = 0; i < rungs; i++) {
    channels.push({ id: `feed${i}`, from: `A${i}`, to: `A${i + 1}`, resistance: 1e10 })
    channels.push({ id: `drain${i}`, from: `B${i}`, to: `B${i + 1}`, resistance: 2e10 })
    channels.push({ id: `nozzle${i}`, from: `A${i + 1}`, to: `B${i + 1}`, resistance: 1e13 })
  }
  return {
    channels,
    sources: [
      { node: 'A0', pressure: 5000 },
      { node: `B${rungs}`, pressure: 0 },
    ],
  }
}

describe('NetworkResolver factor reuse', () => {
  const problem = ladder(60)
  const m = problem.channels.length
  const sets = [0, 1, 2, 3, 4, 5].map(s =>
    Float64Array.from({ length: m }, (_, k) => problem.channels[k]!.resistance * (1 + 0.1 * ((k * (s + 3)) % 7))),
  )
  const fresh = (r: Float64Array, sources = problem.sources) =>
    new NetworkResolver(problem).solve(r, undefined, sources)

  it('gives bit-identical answers at seen and unseen conductances, other sources too', () => {
    const resolver = new NetworkResolver(problem)
    const unit = [
      { node: 'A0', pressure: 1 },
      { node: `B60`, pressure: 0 },
    ]
    // 0, 1, 0 (seen), 2..5 (pushes 0 and 1 out of the four kept), 0 (unseen again), 1 with unit sources
    for (const [s, sources] of [
      [0, problem.sources],
      [1, problem.sources],
      [0, problem.sources],
      [2, problem.sources],
      [3, problem.sources],
      [4, problem.sources],
      [5, problem.sources],
      [0, problem.sources],
      [1, unit],
    ] as const) {
      const ours = resolver.solve(sets[s]!, undefined, sources)
      const theirs = fresh(sets[s]!, sources)
      expect(Array.from(ours.flow)).toEqual(Array.from(theirs.flow))
      expect(Array.from(ours.pressure)).toEqual(Array.from(theirs.pressure))
    }
  })

  it('a resistance changed in place is seen as new conductances', () => {
    const resolver = new NetworkResolver(problem)
    const r = Float64Array.from(sets[0]!)
    resolver.solve(r)
    r[5] = r[5]! * 3
    expect(Array.from(resolver.solve(r).flow)).toEqual(Array.from(fresh(r).flow))
  })
})
