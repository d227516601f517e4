// Issue 11, item 4: requests a new user tried that gave a wrong number marked valid, or crashed the runner.
// Each case names the published limit it checks against.
import { spawnSync } from 'node:child_process'
import { describe, expect, it } from 'vitest'
import { ForecastInputError, runForecast, type JunctionForecast, type NetworkForecast } from '#shared/physics/forecast'
import { STEP_ASPECT, STEP_DIAMETER } from '#shared/physics/junction/step'
import { STEP_CRITICAL } from '#shared/physics/junction/regime'
import { CAPILLARY_DISPERSED } from '#shared/physics/junction/dimensionless'

function issuesOf(request: unknown) {
  try {
    runForecast(request)
  } catch (error) {
    expect(error).toBeInstanceOf(ForecastInputError)
    return (error as ForecastInputError).issues
  }
  throw new Error('expected a ForecastInputError')
}

const tJunction = (patch: Record<string, unknown> = {}) => ({
  junction: { kind: 't-junction', mainWidth: '100 um', inletWidth: '50 um', depth: '50 um' },
  continuous: { viscosity: '3 mPa*s', density: '800 kg/m^3' },
  dispersed: { liquid: 'water' },
  interfacialTension: '5 mN/m',
  flow: { continuous: '1 uL/min', dispersed: '0.5 uL/min' },
  model: { alpha: 1 },
  ...patch,
})

const step = (angle: string) => ({
  junction: { kind: 'step', mainWidth: '100 um', depth: '10 um' },
  continuous: { viscosity: '3 mPa*s', density: '800 kg/m^3' },
  dispersed: { liquid: 'water' },
  interfacialTension: '5 mN/m',
  contactAngle: angle,
  flow: { continuous: '10 uL/min', dispersed: '0.1 uL/min' },
})

const simpleNetwork = (
  channels: unknown[],
  sources: unknown[] = [
    { node: 'in', flow: '5 uL/min' },
    { node: 'out', pressure: 0 },
  ],
  extra: Record<string, unknown> = {},
) => ({ network: { channels, sources, liquid: { viscosity: '3 mPa*s', density: '1000 kg/m^3' }, ...extra } })
const channel = (id: string, from: string, to: string, patch: Record<string, unknown> = {}) => ({
  id,
  from,
  to,
  width: '50 um',
  depth: '50 um',
  length: '1 mm',
  ...patch,
})

describe('a deep, narrow channel (depth 400 µm > width 50 µm)', () => {
  const answer = runForecast(
    tJunction({
      junction: { kind: 't-junction', mainWidth: '50 um', inletWidth: '50 um', depth: '400 um' },
      flow: { continuous: '1 uL/min', dispersed: '0.05 uL/min' },
    }),
  ) as JunctionForecast
  it('gives a positive volume, diameter and frequency (a short drop is a disc, never a negative plug)', () => {
    expect(answer.regime.value).toBe('squeezing')
    expect(answer.dropletVolume.value).toBeGreaterThan(0)
    expect(answer.dropletDiameter.value).toBeGreaterThan(0)
    expect(answer.frequency.value).toBeGreaterThan(0)
  })
  it('marks them invalid: the squeezing laws hold for h ≤ w (Garstecki et al. 2006; van Steijn et al. 2010)', () => {
    expect(answer.dropletVolume.valid).toBe(false)
    expect(answer.frequency.valid).toBe(false)
    expect(answer.warnings.map(w => w.code)).toContain('deep-channel')
  })
})

describe('step emulsification wetting (Eggersdorfer, Seybold, Ofner, Weitz & Studart 2018, PNAS 115, 9479: ≳ 120°)', () => {
  it('a 110° dispersed-phase contact angle is flagged, not valid', () => {
    const answer = runForecast(step('110 deg')) as JunctionForecast
    expect(answer.dropletDiameter.valid).toBe(false)
    expect(answer.warnings.map(w => w.code)).toContain('step-wetting-angle')
  })
  it('130° passes the wetting check', () => {
    const answer = runForecast(step('130 deg')) as JunctionForecast
    expect(answer.warnings.map(w => w.code)).not.toContain('step-wetting-angle')
    expect(answer.dropletDiameter.valid).toBe(true)
  })
})

describe('citations', () => {
  it('Lab Chip 15, 1023 is Li, Leshansky, Pismen & Tabeling; the 2.6 aspect threshold is Montessori et al. 2019, Phys. Fluids', () => {
    for (const method of [STEP_DIAMETER, STEP_CRITICAL, CAPILLARY_DISPERSED]) {
      expect(method.source).toContain('Li, Leshansky, Pismen & Tabeling 2015, Lab Chip 15, 1023')
      expect(method.source).not.toContain('Sauret')
    }
    expect(STEP_ASPECT.source).toContain('Montessori et al. 2019, Phys. Fluids')
  })
})

describe('networks', () => {
  it('duplicate channel ids are refused, naming the second one', () => {
    const issues = issuesOf(simpleNetwork([channel('a', 'in', 'm'), channel('a', 'm', 'out')]))
    expect(issues).toEqual([
      { path: 'network.channels.1.id', message: expect.stringContaining('"a" is already used by channel 0') },
    ])
  })
  it('an error inside a network names the field and the reason ("5 kg" width, zero length)', () => {
    const issues = issuesOf(simpleNetwork([channel('a', 'in', 'out', { width: '5 kg', length: '0 mm' })]))
    expect(issues.map(i => i.path)).toEqual(['network.channels.0.width', 'network.channels.0.length'])
    expect(issues[0]!.message).toContain('is not a length')
    expect(issues[1]!.message).toContain('must be > 0')
  })
  it('the pump margin counts suction: a source pulling −300 mbar uses 300 mbar of a 200 mbar pump', () => {
    const answer = runForecast(
      simpleNetwork(
        [channel('a', 'in', 'out')],
        [
          { node: 'in', pressure: 0 },
          { node: 'out', pressure: '-300 mbar' },
        ],
        { limits: { pumpPressure: '200 mbar', bondPressure: '2 bar' } },
      ),
    ) as NetworkForecast
    expect(answer.margins!.pumpPressure!.ok).toBe(false)
    expect(answer.margins!.pumpPressure!.highest).toBeCloseTo(30000, 6)
    expect(answer.margins!.bondPressure!.ok).toBe(true)
  })
  it('more suction than a vacuum (−1013 mbar, ISO 2533 standard atmosphere) is a warning', () => {
    const answer = runForecast(
      simpleNetwork(
        [channel('a', 'in', 'out')],
        [
          { node: 'in', pressure: 0 },
          { node: 'out', pressure: '-1.2 bar' },
        ],
      ),
    ) as NetworkForecast
    expect(answer.warnings.map(w => w.code)).toContain('suction-beyond-vacuum')
  })
})

describe('lab units', () => {
  it('"3 cP" is 3 mPa·s and "5 µL/min" (micro sign or Greek mu) is 5 uL/min (BIPM SI Brochure, 9th ed.: 1 cP = 1 mPa·s)', () => {
    const base = runForecast(tJunction()) as JunctionForecast
    for (const [viscosity, flow] of [
      ['3 cP', '0.5 µL/min'],
      ['0.03 P', '0.5 μL/min'],
    ]) {
      const answer = runForecast(
        tJunction({
          continuous: { viscosity, density: '800 kg/m^3' },
          flow: { continuous: '1 uL/min', dispersed: flow },
        }),
      ) as JunctionForecast
      expect(answer.inputs.continuous.viscosity.value).toBeCloseTo(base.inputs.continuous.viscosity.value, 15)
      expect(answer.inputs.flow.dispersed.value).toBeCloseTo(base.inputs.flow.dispersed.value, 22)
    }
    expect((runForecast(tJunction({ temperature: '20 °C' })) as JunctionForecast).inputs.temperature.value).toBeCloseTo(
      293.15,
      9,
    )
  })
  it('extreme magnitudes (1e200 m, 1e-300 m, 1e308 kg/m³) are refused naming each field, never a crash', () => {
    const issues = issuesOf(
      tJunction({
        junction: { kind: 't-junction', mainWidth: 1e200, depth: 1e-300 },
        continuous: { viscosity: '3 mPa*s', density: 1e308 },
      }),
    )
    expect(issues.map(i => i.path)).toEqual(['junction.mainWidth', 'junction.depth', 'continuous.density'])
  })
})

describe('the runner (npm run forecast)', () => {
  const run = (request: unknown) =>
    spawnSync(process.execPath, ['--import', 'tsx', 'scripts/forecast.ts'], {
      input: JSON.stringify(request),
      encoding: 'utf8',
      cwd: new URL('../../..', import.meta.url).pathname,
    })
  it('a bare number as temperature (kelvin) outside the range exits 2 naming temperature, no stack trace', () => {
    const result = run(tJunction({ temperature: 20 }))
    expect(result.status).toBe(2)
    expect(result.stderr).toMatch(/^invalid request: temperature: /)
    expect(result.stderr).not.toMatch(/\n\s+at /)
  }, 30_000)
  it("a temperature outside a liquid correlation's range answers with the properties flagged, exit 0", () => {
    const result = run(tJunction({ temperature: '150 degC' }))
    expect(result.status).toBe(0)
    const answer = JSON.parse(result.stdout) as JunctionForecast
    expect(answer.inputs.dispersed.viscosity.valid).toBe(false)
    expect(answer.dropletDiameter.valid).toBe(false)
  }, 30_000)
})

describe('found by the property test (tests/unit/physics/forecast-properties.test.ts)', () => {
  it('water at −60 °C is evaluated at the 0 °C edge of IAPWS, flagged — not an extrapolated viscosity of zero', () => {
    const answer = runForecast(tJunction({ temperature: '-60 degC' })) as JunctionForecast
    const water = answer.inputs.dispersed.viscosity
    expect(water.valid).toBe(false)
    // IAPWS R12-08 at 0 °C: 1.7914 mPa·s (the release's table value, from memory to 4 digits).
    expect(water.value).toBeCloseTo(1.7914e-3, 6)
    expect(answer.viscosityRatio.value).toBeGreaterThan(0)
    expect(answer.warnings.find(w => w.code === 'liquid-temperature-out-of-range')!.message).toContain('nearest edge')
  })
  it('a network floating at −48 bar with picolitre flows still conserves flow (solved relative to its fixed pressures)', () => {
    const request = simpleNetwork(
      [
        channel('a', 'in', 'm', { width: '10 mm', depth: '10 mm', length: '1 m' }),
        channel('b', 'm', 'out', { width: '5 mm', depth: '10 mm', length: '1 m' }),
      ],
      [
        { node: 'in', flow: 1.7e-10 },
        { node: 'out', pressure: '-48 bar' },
      ],
    )
    const answer = runForecast(request) as NetworkForecast
    const [inlet, outlet] = answer.inlets
    expect(Math.abs(inlet!.flow.value + outlet!.flow.value)).toBeLessThan(1e-12 * inlet!.flow.value)
  })
})
