import { describe, expect, it } from 'vitest'
import { checkDesignRules } from '../../../geometry/rules'
import { findProcess } from '../../../geometry/rules/processes'
import { runForecast, type DocumentForecast } from '../../../shared/physics/forecast'
import { runPlan } from '../../../shared/physics/planner'
import { designFromSuggestion } from '../../../shared/physics/planner/design'

const liquids = {
  continuous: { liquid: 'hydrofluoroether' },
  dispersed: { liquid: 'water' },
  interfacialTension: '3 mN/m',
}

describe('geometry suggestions', () => {
  it('a 25 µm step emulsifier: nozzle depth d/4 (Dangla et al. 2013), the aspect limit, and an array the design rules accept', () => {
    const plan = runPlan({
      junction: { kind: 'step', mainWidth: '30 um', depth: '10 um' },
      ...liquids,
      target: { dropletDiameter: '25 um', minFrequency: '5 kHz' },
      process: 'film-mask-soft-litho',
    })
    const step = plan.geometry.find(g => g.kind === 'step')!
    expect(step.junction.depth.value).toBeCloseTo(25e-6 / 4, 9) // 6.25 µm
    expect(step.junction.mainWidth.value / step.junction.depth.value).toBeGreaterThanOrEqual(2.6) // Montessori et al. aspect limit
    expect(step.junction.mainWidth.value).toBeGreaterThanOrEqual(20e-6) // the film-mask process's minimum feature
    expect(step.process.ok).toBe(true)
    expect(step.count).toBeGreaterThan(1)
    expect(step.expected.totalFrequency.value).toBeGreaterThanOrEqual(5000)
    expect(step.law.source).toMatch(/Dangla/)
    const doc = designFromSuggestion(step, 'Planned step emulsifier')
    const errors = checkDesignRules(doc, findProcess('film-mask-soft-litho')!).filter(f => f.severity === 'error')
    expect(errors).toEqual([])
    const forecast = runForecast({ document: doc }) as DocumentForecast
    const sized = forecast.junctions.filter(j => j.forecast)
    expect(sized.length).toBe(step.count)
    expect(sized[0]!.forecast!.dropletDiameter.value).toBeCloseTo(25e-6, 9)
  })

  it('a T-junction inside the van Steijn et al. 2010 range, checked against the process, and its chip', () => {
    const plan = runPlan({
      junction: { kind: 't-junction', mainWidth: '35 um', inletWidth: '25 um', depth: '25 um' },
      ...liquids,
      target: { dropletDiameter: '60 um', minFrequency: '100 Hz' },
      process: 'film-mask-soft-litho',
    })
    const t = plan.geometry.find(g => g.kind === 't-junction')!
    expect(t.junction.depth.value / t.junction.mainWidth.value).toBeLessThanOrEqual(0.5)
    expect(t.expected.dropletDiameter.valid).toBe(true)
    expect(Math.abs(t.expected.dropletDiameter.value - 60e-6) / 60e-6).toBeLessThan(0.05)
    expect(t.expected.regime).toBe('squeezing')
    expect(t.valid).toBe(t.process.ok)
    const doc = designFromSuggestion(t, 'Planned T-junctions')
    expect(checkDesignRules(doc, findProcess('film-mask-soft-litho')!).filter(f => f.severity === 'error')).toEqual([])
  })

  it('says when the process cannot make the suggested sizes', () => {
    // A 12 µm drop wants a 3 µm deep step nozzle: below the film-mask process's 5 µm depth, fine on chrome.
    const film = runPlan({
      junction: { kind: 'step', mainWidth: '30 um', depth: '10 um' },
      ...liquids,
      target: { dropletDiameter: '12 um' },
      process: 'film-mask-soft-litho',
    })
    const step = film.geometry.find(g => g.kind === 'step')!
    expect(step.process.ok).toBe(false)
    expect(step.process.problems.join(' ')).toMatch(/depth 3 µm is below the process's 5 µm/)
    const chrome = runPlan({
      junction: { kind: 'step', mainWidth: '30 um', depth: '10 um' },
      ...liquids,
      target: { dropletDiameter: '12 um' },
      process: 'chrome-mask-soft-litho',
    })
    expect(chrome.geometry.find(g => g.kind === 'step')!.process.ok).toBe(true)
  })
})
