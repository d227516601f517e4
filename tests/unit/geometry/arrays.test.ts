import { describe, expect, it } from 'vitest'
import { ladderNonUniformity, planParallelChip, rectResistancePerViscosity } from '~~/geometry/arrays'
import { BUILT_IN_PROCESSES, checkDesignRules } from '~~/geometry/rules'

// Sources: geometry/arrays/resistance.ts (Bruus 2008 approximation; ladder criterion derived from Kirchhoff's laws).
describe('parallel step-nozzle chip generator', () => {
  it('builds a valid document with N nozzles whose channels all meet their terminals', () => {
    const plan = planParallelChip({ nozzles: 40, nozzlesPerBank: 16 })
    expect(plan.banks).toBe(3)
    expect(plan.document.components.filter((c) => c.kind === 'step-nozzle')).toHaveLength(40)
    const findings = checkDesignRules(plan.document, BUILT_IN_PROCESSES[0]!)
    expect(findings.filter((f) => f.severity !== 'info')).toEqual([])
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
    // Parallel-plate Poiseuille flow (Bruus 2008, §4.3): R = 12 μ L / (w h³) as h/w → 0.
    expect(rectResistancePerViscosity(1e6, 10, 100) / ((12 * 100) / (1e6 * 1000))).toBeCloseTo(1, 4)
  })
})
