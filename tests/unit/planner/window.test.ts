import { describe, expect, it } from 'vitest'
import { ForecastInputError, runForecast, type JunctionForecast } from '../../../shared/physics/forecast'
import { runPlan, windowCsv } from '../../../shared/physics/planner'

// The demo T-junction's liquids: n-hexadecane with sorbitan monooleate around water, 35 × 25 µm main channel.
const demo = {
  junction: { kind: 't-junction', mainWidth: '35 um', inletWidth: '25 um', depth: '25 um' },
  continuous: { liquid: 'n-hexadecane' },
  dispersed: { liquid: 'water' },
  surfactant: 'sorbitan-monooleate',
  temperature: '22 degC',
}

function issuesOf(f: () => unknown): { path: string; message: string }[] {
  try {
    f()
  } catch (error) {
    if (error instanceof ForecastInputError) return error.issues
    throw error
  }
  throw new Error('expected a ForecastInputError')
}

describe('the planner window of one junction', () => {
  it('answers 40 µm at ≥ 500 Hz for the demo T-junction with a window, contours and a recommended point', () => {
    const plan = runPlan({
      ...demo,
      target: { dropletDiameter: '40 um', tolerance: 0.05, minFrequency: '500 Hz' },
      search: { continuous: ['0.1 uL/min', '100 uL/min'], dispersed: ['0.1 uL/min', '100 uL/min'] },
    })
    expect(plan.window.points).toHaveLength(25 * 25)
    expect(plan.window.counts.hits).toBeGreaterThan(0)
    for (const p of plan.window.points.slice(0, 5)) {
      expect(p.flow.continuous).toMatchObject({
        unit: 'm^3/s',
        method: expect.any(String),
        source: expect.any(String),
        valid: expect.any(Boolean),
      })
      expect(p.dropletDiameter).toMatchObject({ unit: 'm', method: expect.any(String), source: expect.any(String) })
      expect(typeof p.regime).toBe('string')
    }
    expect(plan.window.contours.find(c => c.name === 'target-diameter')!.points.length).toBeGreaterThan(3)
    const rec = plan.recommended!
    expect(rec.reason.length).toBeGreaterThan(20)
    expect(Math.abs(rec.dropletDiameter!.value - 40e-6)).toBeLessThanOrEqual(0.05 * 40e-6)
    expect(rec.frequency!.value).toBeGreaterThanOrEqual(500)
    expect(rec.regime).not.toBe('jetting')
  })

  it('self-consistency: the recommended point fed back through the forecast gives the target (many targets and liquids)', () => {
    const liquids = [
      { continuous: { liquid: 'n-hexadecane' }, dispersed: { liquid: 'water' }, surfactant: 'sorbitan-monooleate' },
      {
        continuous: { liquid: 'light-mineral-oil' },
        dispersed: { liquid: 'water' },
        surfactant: 'sorbitan-monooleate',
      },
      { continuous: { liquid: 'hydrofluoroether' }, dispersed: { liquid: 'water' }, interfacialTension: '3 mN/m' },
      {
        continuous: { viscosity: '10 mPa*s', density: '900 kg/m^3' },
        dispersed: { liquid: 'glycerol-water', massFraction: 0.4 },
        interfacialTension: '8 mN/m',
      },
    ]
    const junctions = [
      { kind: 't-junction', mainWidth: '100 um', inletWidth: '50 um', depth: '40 um' },
      { kind: 't-junction', mainWidth: '60 um', inletWidth: '60 um', depth: '25 um' },
      { kind: 'flow-focusing', mainWidth: '40 um', inletWidth: '60 um', depth: '40 um' },
    ]
    let checked = 0
    for (const l of liquids) {
      for (const junction of junctions) {
        const w = Number.parseFloat(junction.mainWidth)
        for (const factor of [1.3, 1.6, 2]) {
          const target = { dropletDiameter: `${(w * factor).toFixed(1)} um`, tolerance: 0.05 }
          const request = { junction, ...l, target, search: { points: 30 } }
          const plan = runPlan(request)
          if (!plan.recommended) {
            expect(plan.unreachable!.reason.length).toBeGreaterThan(10)
            continue
          }
          const { target: _t, search: _s, ...forecastPart } = request
          const back = runForecast({
            ...forecastPart,
            flow: {
              continuous: plan.recommended.flow.continuous.value,
              dispersed: plan.recommended.flow.dispersed.value,
            },
          }) as JunctionForecast
          const d = w * factor * 1e-6
          expect(Math.abs(back.dropletDiameter.value - d) / d, `${JSON.stringify(request)}`).toBeLessThanOrEqual(0.05)
          expect(back.dropletDiameter.valid).toBe(plan.recommended.dropletDiameter!.valid)
          checked++
        }
      }
    }
    expect(checked).toBeGreaterThanOrEqual(24)
  })

  it('explains an unreachable target with the nearest reachable size', () => {
    const plan = runPlan({
      ...demo,
      junction: { kind: 't-junction', mainWidth: '100 um', inletWidth: '50 um', depth: '40 um' },
      target: { dropletDiameter: '10 um' },
    })
    expect(plan.recommended).toBeNull()
    expect(plan.unreachable!.reason).toMatch(/smaller than any/)
    expect(plan.unreachable!.nearest!.dropletDiameter.value).toBeGreaterThan(10e-6 * 1.05)
    expect(plan.unreachable!.reachable!.smallest.unit).toBe('m')
    // The geometry suggestions still answer what would reach it.
    expect(plan.geometry.some(g => Math.abs(g.expected.dropletDiameter.value - 10e-6) < 1e-6)).toBe(true)
  })

  it('refuses bad input naming the field', () => {
    expect(issuesOf(() => runPlan({ ...demo, target: { dropletDiameter: '40 kg' } })).map(i => i.path)).toContain(
      'target.dropletDiameter',
    )
    expect(issuesOf(() => runPlan({ ...demo })).map(i => i.path)).toContain('target')
    expect(
      issuesOf(() =>
        runPlan({ ...demo, target: { dropletDiameter: '40 um' }, search: { continuous: ['10 uL/min', '1 uL/min'] } }),
      ).map(i => i.path),
    ).toContain('search.continuous')
    expect(
      issuesOf(() =>
        runPlan({ ...demo, target: { dropletDiameter: '40 um' }, encapsulation: { concentration: '2e6' } }),
      )[0]!.message,
    ).toMatch(/no unit/)
    expect(
      issuesOf(() =>
        runPlan({ ...demo, target: { dropletDiameter: '40 um' }, flow: { continuous: 1, dispersed: 1 } }),
      )[0]!.message,
    ).toMatch(/unknown field/)
    expect(issuesOf(() => runPlan({ target: { dropletDiameter: '40 um' } }))[0]!.message).toMatch(
      /"junction" or "document"/,
    )
  })

  it('exports the window as CSV with lab units in the header', () => {
    const plan = runPlan({ ...demo, target: { dropletDiameter: '40 um' }, search: { points: 5 } })
    const csv = windowCsv(plan.window).trim().split('\n')
    expect(csv[0]).toContain('continuous_flow_uL_min')
    expect(csv).toHaveLength(26)
    const first = csv[1]!.split(',')
    expect(Number(first[0])).toBeCloseTo(0.1, 6) // 0.1 µL/min, the default search's low end
  })

  it('adds loading, a digital assay and a run plan at the recommended point', () => {
    const plan = runPlan({
      ...demo,
      target: { dropletDiameter: '40 um' },
      encapsulation: { concentration: '2e6 /mL' },
      digital: { partitions: 20000 },
      run: { droplets: 1_000_000 },
    })
    const rec = plan.recommended!
    const v = (Math.PI / 6) * rec.dropletDiameter!.value ** 3
    expect(plan.encapsulation!.lambda.value).toBeCloseTo(2e12 * v, 8)
    expect(plan.encapsulation!.cellsPerHour!.value).toBeCloseTo(2e12 * v * rec.frequency!.value * 3600, 0)
    expect(plan.run!.duration.value).toBeCloseTo(1e6 / rec.frequency!.value, 6)
    expect(plan.run!.dispersedVolume.value).toBeCloseTo(rec.flow.dispersed.value * plan.run!.duration.value, 15)
    expect(plan.digital!.partitionVolume.value).toBeCloseTo(v, 20)
  })
})
