import { describe, expect, it } from 'vitest'
import { digitalAssay, dubeEstimate, normalQuantile, relativePrecision } from '../../../shared/physics/planner/digital'

describe('digital assay statistics (Dube, Qin & Ramakrishnan 2008, PLoS ONE 3, e2876)', () => {
  it('uses the standard normal quantiles of the tables (z0.975 = 1.95996, z0.995 = 2.57583)', () => {
    expect(normalQuantile(0.975)).toBeCloseTo(1.959964, 6)
    expect(normalQuantile(0.995)).toBeCloseTo(2.575829, 6)
    expect(normalQuantile(0.5)).toBeCloseTo(0, 12)
    expect(normalQuantile(0.001)).toBeCloseTo(-3.090232, 6)
  })

  it('estimates λ = −ln(1 − k/n) with the binomial interval carried through, as Dube et al. derive it', () => {
    // A 765-chamber panel (the paper's device) with 500 positives, worked here by hand from the paper's formulas:
    // p = 500/765 = 0.65359; λ = −ln(0.34641) = 1.06015, 811.0 molecules in the panel;
    // half-width 1.95996 √(p(1 − p)/765) = 0.033718 → p ∈ [0.61988, 0.68731] → λ ∈ [0.96726, 1.16255].
    // The same recipe is the "dube" method of the independent dpcR R package (calc_lambda.R).
    const e = dubeEstimate(500, 765)
    expect(e.p).toBeCloseTo(0.65359, 5)
    expect(e.lambda).toBeCloseTo(1.06015, 5)
    expect(e.molecules).toBeCloseTo(811.0, 1)
    expect(e.lambdaLow).toBeCloseTo(0.96726, 4)
    expect(e.lambdaHigh).toBeCloseTo(1.16255, 4)
    // The interval is asymmetric in λ (wider above), as −ln(1 − p) is convex.
    expect(e.lambdaHigh - e.lambda).toBeGreaterThan(e.lambda - e.lambdaLow)
  })

  it('has its best precision near λ ≈ 1.59 copies per partition (Majumdar, Wessel & Marks 2015, PLoS ONE 10, e0118833)', () => {
    let best = { lambda: 0, value: Infinity }
    for (let lambda = 0.1; lambda < 5; lambda += 0.001) {
      const v = relativePrecision(lambda, 20000)
      if (v < best.value) best = { lambda, value: v }
    }
    expect(best.lambda).toBeCloseTo(1.59, 2)
  })

  it('gives the dynamic range from one positive to one negative partition, in concentration', () => {
    const volume = 33.5e-15 // 33.5 pL
    const d = digitalAssay(20000, volume, 4000)
    expect(d.dynamicRange.lambdaLowest.value).toBeCloseTo(-Math.log(1 - 1 / 20000), 12)
    expect(d.dynamicRange.lambdaHighest.value).toBeCloseTo(Math.log(20000), 12)
    expect(d.dynamicRange.lowest.value).toBeCloseTo(d.dynamicRange.lambdaLowest.value / volume, 0)
    expect(d.estimate!.concentration.value).toBeCloseTo(-Math.log(1 - 0.2) / volume, -3)
    expect(d.estimate!.low.value).toBeLessThan(d.estimate!.concentration.value)
    expect(d.precision.length).toBeGreaterThan(10)
    // All partitions positive: the estimate is only a bound and says so.
    expect(digitalAssay(100, volume, 100).estimate!.lambda.valid).toBe(false)
  })
})

describe('Dube interval against an independent computation', () => {
  it("matches the recipe computed in Python with SciPy's normal quantile (tests/fixtures/plan/poisson-scipy.json)", async () => {
    const { dube } = (await import('../../fixtures/plan/poisson-scipy.json')).default
    for (const c of dube.cases) {
      const e = dubeEstimate(c.k, c.n)
      expect(e.lambda).toBeCloseTo(c.lambda, 10)
      expect(e.lambdaLow).toBeCloseTo(c.low, 8)
      expect(e.lambdaHigh).toBeCloseTo(c.high, 8)
    }
  })
})
