import { describe, expect, it } from 'vitest'
import { ladderNonUniformity, planParallelChip, rectResistancePerViscosity } from '~~/geometry/arrays'
import { BUILT_IN_PROCESSES, checkDesignRules } from '~~/geometry/rules'

// Sources: geometry/arrays/resistance.ts (Bruus 2008 approximation; ladder criterion derived from Kirchhoff's laws).
describe('parallel step-nozzle chip generator', () => {
  it('builds a valid document with N nozzles whose channels all meet their terminals', () => {
    const plan = planParallelChip({ nozzles: 40, nozzlesPerBank: 16 })
    expect(plan.banks).toBe(3)
    expect(plan.document.components.filter(c => c.kind === 'step-nozzle')).toHaveLength(40)
    const findings = checkDesignRules(plan.document, BUILT_IN_PROCESSES[0]!)
    expect(findings.filter(f => f.severity !== 'info')).toEqual([])
  })
  it('sizes the manifold to the non-uniformity target', () => {
    const plan = planParallelChip({ nozzles: 128, nozzlesPerBank: 128, targetNonUniformity: 0.02 })
    const { width, nonUniformity } = plan.manifold
    expect(nonUniformity).toBeLessThanOrEqual(0.02)
    const nozzle = rectResistancePerViscosity(30, 8, 150)
    expect(ladderNonUniformity(rectResistancePerViscosity(width, 150, 60), nozzle, 128)).toBeCloseTo(nonUniformity, 12)
    expect(ladderNonUniformity(rectResistancePerViscosity(width - 2, 150, 60), nozzle, 128)).toBeGreaterThan(0.02)
  })
  it('Bruus approximation: a flat channel tends to the parallel-plate value 12L/(w h³)', () => {
    // Parallel-plate Poiseuille flow (Bruus 2008, Theoretical Microfluidics; section §4.3 from memory, not verified): R = 12 μ L / (w h³) as h/w → 0.
    expect(rectResistancePerViscosity(1e6, 10, 100) / ((12 * 100) / (1e6 * 1000))).toBeCloseTo(1, 4)
  })
  it('Bruus approximation against the exact rectangular-duct series: +14 % at a square section, < 1 % at h/w = 0.1', () => {
    // Exact laminar resistance of a rectangular duct (Fourier series of the Poisson problem, classical):
    // R = 12 μ L / (w h³) · [1 − (192 h / (π⁵ w)) Σ_{n odd} tanh(n π w / 2h) / n⁵]⁻¹, h ≤ w. Tolerance 0.01.
    const exact = (w: number, h: number, L: number) => {
      let sum = 0
      for (let n = 1; n < 200; n += 2) sum += Math.tanh((n * Math.PI * w) / (2 * h)) / n ** 5
      return (12 * L) / (w * h ** 3) / (1 - ((192 * h) / (Math.PI ** 5 * w)) * sum)
    }
    expect(rectResistancePerViscosity(50, 50, 100) / exact(50, 50, 100)).toBeCloseTo(1.14, 2)
    expect(Math.abs(rectResistancePerViscosity(100, 10, 100) / exact(100, 10, 100) - 1)).toBeLessThan(0.01)
  })
})
