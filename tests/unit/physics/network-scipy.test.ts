// The sparse network solve against SciPy's sparse direct solver: tests/fixtures/network/scipy-reference.json was
// written once by scripts/bench/scipy_reference.py (scipy.sparse.linalg.spsolve, SuperLU, from Debian's
// python3-scipy), which builds the Kirchhoff system from the channel list on its own. Always runs (no Python needed).
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { solveNetwork, type NetworkProblem } from '../../../shared/physics/network'

interface ReferenceCase {
  name: string
  problem: NetworkProblem
  pressure: Record<string, number>
  flow: number[]
}
const reference = JSON.parse(
  readFileSync(new URL('../../fixtures/network/scipy-reference.json', import.meta.url), 'utf8'),
) as { solver: string; cases: ReferenceCase[] }

/** Largest |ours − theirs| over the largest |theirs|: relative to the scale of the answer. */
function relativeError(ours: ArrayLike<number>, theirs: ArrayLike<number>): number {
  let diff = 0
  let scale = 0
  for (let i = 0; i < theirs.length; i++)
    ((diff = Math.max(diff, Math.abs(ours[i]! - theirs[i]!))), (scale = Math.max(scale, Math.abs(theirs[i]!))))
  return diff / scale
}

describe(`network solve agrees with ${reference.solver} (tests/fixtures/network/scipy-reference.json)`, () => {
  it('has the three stored cases', () => expect(reference.cases.map(c => c.name)).toHaveLength(3))
  for (const c of reference.cases) {
    it(`${c.name}: pressures and flows within 1e-9 relative`, () => {
      const solution = solveNetwork(c.problem)
      const theirs = solution.nodeIds.map(id => c.pressure[id]!)
      expect(theirs.every(Number.isFinite)).toBe(true)
      expect(relativeError(solution.pressure, theirs)).toBeLessThan(1e-9)
      expect(relativeError(solution.flow, c.flow)).toBeLessThan(1e-9)
    })
  }
})
