import { describe, expect, it } from 'vitest'
import { runPlan } from '../../../shared/physics/planner'
import { axisInLabUnits, occupancyOption, pointAxes, windowMapOption } from '../../../utils/plannerPlots'

const plan = runPlan({
  junction: { kind: 't-junction', mainWidth: '35 um', inletWidth: '25 um', depth: '25 um' },
  continuous: { liquid: 'n-hexadecane' },
  dispersed: { liquid: 'water' },
  surfactant: 'sorbitan-monooleate',
  target: { dropletDiameter: '40 um', minFrequency: '500 Hz' },
  search: { points: 9 },
  encapsulation: { concentration: '2e6 /mL' },
})

describe('planner plots', () => {
  it('the window map: axes in µL/min with their names, a legend entry for the recommended point and the target line', () => {
    const option = windowMapOption(plan.window, plan.recommended) as any
    expect(option.xAxis.name).toBe('continuous flow, µL/min')
    expect(option.yAxis.name).toBe('dispersed flow, µL/min')
    expect(option.xAxis.min).toBeCloseTo(0.1 / 1.25, 9) // the search's low end, 0.1 µL/min, padded
    const names = option.series.map((s: { name: string }) => s.name)
    expect(names).toContain('recommended point')
    expect(names).toContain('hits the target')
    expect(names.some((n: string) => /^target Ø 40 µm$/.test(n))).toBe(true)
    const rec = option.series.find((s: { name: string }) => s.name === 'recommended point')
    expect(rec.data[0].value).toEqual(pointAxes(plan.window, plan.recommended!))
    expect(axisInLabUnits('flow', 1e-9 / 60)).toBeCloseTo(1, 12) // 1 µL/min
    expect(axisInLabUnits('pressure', 100)).toBe(1) // 1 mbar
  })

  it('the occupancy bars show P(0)…P(5) of the loading', () => {
    const option = occupancyOption(plan.encapsulation!) as any
    expect(option.xAxis.data).toEqual(['0', '1', '2', '3', '4', '5'])
    expect(option.series[0].data[0]).toBeCloseTo(plan.encapsulation!.empty.value * 100, 10) // percent of drops
  })
})
