import { describe, expect, it } from 'vitest'
import { encapsulation, occupancy, poissonPmf } from '../../../shared/physics/planner/poisson'

describe('Poisson loading (Collins et al. 2015, Lab Chip 15, 3439)', () => {
  it('matches the closed form P(k) = λ^k e^−λ / k! and sums to one', () => {
    for (const lambda of [1e-6, 1e-3, 0.05, 0.1, 0.3, 1, 3, 10]) {
      const o = occupancy(lambda)
      expect(o.empty).toBeCloseTo(Math.exp(-lambda), 14)
      expect(o.single).toBeCloseTo(lambda * Math.exp(-lambda), 14)
      expect(o.empty + o.single + o.multiple).toBeCloseTo(1, 12)
      const pmf = poissonPmf(lambda, 60)
      expect(pmf[3]).toBeCloseTo((lambda ** 3 * Math.exp(-lambda)) / 6, 14)
    }
    // Small λ: the multiple share keeps its digits (λ²/2 leading term) instead of cancelling to 0.
    expect(occupancy(1e-6).multiple / (1e-12 / 2)).toBeCloseTo(1, 5)
  })

  it('gives the textbook shares at λ = 0.1 and λ = 1 (Poisson tables, e.g. CRC Standard Probability and Statistics Tables, 4 decimals)', () => {
    // λ = 0.1: 0.9048 empty, 0.0905 single, 0.0047 two or more (the "one in ten" loading)
    const a = occupancy(0.1)
    expect(a.empty).toBeCloseTo(0.9048, 4)
    expect(a.single).toBeCloseTo(0.0905, 4)
    expect(a.multiple).toBeCloseTo(0.0047, 4)
    // λ = 1: 0.3679, 0.3679, 0.2642 (the single-occupancy maximum of 1/e)
    const b = occupancy(1)
    expect(b.empty).toBeCloseTo(0.3679, 4)
    expect(b.single).toBeCloseTo(0.3679, 4)
    expect(b.multiple).toBeCloseTo(0.2642, 4)
  })

  it('loads 40 µm drops from 2 million cells/mL: λ = c V, cells per hour, concentration for λ = 0.1', () => {
    const volume = (Math.PI / 6) * 40e-6 ** 3 // 33.5 pL
    const e = encapsulation(2e12, volume, 500) // 2e6 /mL = 2e12 /m³, 500 Hz
    expect(e.lambda.value).toBeCloseTo(2e12 * 3.3510321638e-14, 6) // 0.0670
    expect(e.cellsPerHour!.value).toBeCloseTo(e.lambda.value * 500 * 3600, 6)
    // c = λ/V: 0.1 / 33.51 pL = 2.98e6 /mL
    expect(e.concentrationForTarget.value / 1e6 / 1e6).toBeCloseTo(2.984, 3)
    expect(e.empty.unit).toBe('1')
    expect(e.lambda).toMatchObject({ method: 'poisson-loading', valid: true })
    expect(e.lambda.source).toContain('Lab Chip 15, 3439')
  })
})

describe('Poisson loading against an independent library', () => {
  it("matches SciPy's Poisson distribution to 1e-12 (recorded in tests/fixtures/plan/poisson-scipy.json)", async () => {
    const { rows } = (await import('../../fixtures/plan/poisson-scipy.json')).default
    for (const r of rows) {
      const o = occupancy(r.lambda)
      expect(o.empty, `λ = ${r.lambda}`).toBeCloseTo(r.empty, 12)
      expect(o.single, `λ = ${r.lambda}`).toBeCloseTo(r.single, 12)
      expect(o.multiple, `λ = ${r.lambda}`).toBeCloseTo(r.multiple, 12)
    }
  })
})
