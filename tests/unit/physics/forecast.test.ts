import { describe, expect, it } from 'vitest'
import { fitSqueezingAlpha, fitThroughOrigin, tQuantile975 } from '#shared/physics/calibration'
import { ForecastInputError, runForecast } from '#shared/physics/forecast'
import type { Metres } from '#shared/physics/units'
import example from '../../fixtures/forecast/t-junction-request.json' // the example of docs/forecast-api.md

const withFields = (patch: Record<string, unknown>) => JSON.parse(JSON.stringify({ ...example, ...patch }))

function issuesOf(request: unknown) {
  try {
    runForecast(request)
  } catch (error) {
    expect(error).toBeInstanceOf(ForecastInputError)
    return (error as ForecastInputError).issues
  }
  throw new Error('expected a ForecastInputError')
}

function allNumbers(value: unknown, out: number[] = []): number[] {
  if (typeof value === 'number') out.push(value)
  else if (value && typeof value === 'object') for (const v of Object.values(value)) allNumbers(v, out)
  return out
}

describe('junction forecast, the documented example', () => {
  const answer = runForecast(example) as any
  it('computes Ca = μc Qc/(w h γ) = 0.02 and L = w(1 + α Qd/Qc) (Ca/0.01)^(−0.2) = 150 µm × 2^(−0.2) (Garstecki et al. 2006 anchored, Xu et al. 2008 form)', () => {
    expect(answer.capillaryNumber.value).toBeCloseTo((0.003 * (10e-9 / 60)) / (100e-6 * 50e-6) / 0.005, 12)
    expect(answer.dropletLength.value).toBeCloseTo(150e-6 * 2 ** -0.2, 12)
    expect(answer.flowRateRatio.value).toBe(0.5)
    // Mayer–Stowe–Princen cap of the 100 × 50 µm channel (tests/unit/physics/junction.test.ts): 284.94 Pa.
    expect(answer.laplacePressure.value).toBeCloseTo(284.94, 2)
  })
  it('generation rate is f = Qd/V and every quantity carries unit, method, source and validity', () => {
    expect(answer.frequency.value * answer.dropletVolume.value).toBeCloseTo(5e-9 / 60, 20)
    for (const key of [
      'capillaryNumber',
      'reynoldsNumber',
      'weberNumber',
      'bondNumber',
      'viscosityRatio',
      'flowRateRatio',
      'laplacePressure',
      'entryPressure',
      'dropletLength',
      'dropletVolume',
      'dropletDiameter',
      'frequency',
      'spacing',
    ]) {
      expect(answer[key], key).toMatchObject({
        unit: expect.any(String),
        method: expect.any(String),
        source: expect.any(String),
        valid: expect.any(Boolean),
      })
    }
  })
  it('a nominal Ca of 0.02 (computed 0.020000000000000004) lands in the transition band the docs say includes 0.02, flagged invalid', () => {
    expect(answer.capillaryNumber.value).toBeGreaterThan(0.02)
    expect(answer.regime.value).toBe('transition')
    expect(answer.dropletLength.valid).toBe(false)
    expect(answer.warnings.map((w: any) => w.code)).toEqual(
      expect.arrayContaining(['regime-transition', 'dripping-law-indicative']),
    )
  })
  it('contains no NaN or Infinity', () => {
    expect(allNumbers(answer).every(Number.isFinite)).toBe(true)
  })
})

describe('junction forecast, behaviour', () => {
  it('low Ca squeezing without α uses van Steijn 2010 and is valid', () => {
    const answer = runForecast(
      withFields({ flow: { continuous: '1 uL/min', dispersed: '0.5 uL/min' }, model: undefined }),
    ) as any
    expect(answer.regime.value).toBe('squeezing')
    expect(answer.dropletVolume.method).toMatch(/van-steijn-2010/)
    expect(answer.dropletVolume.valid).toBe(true)
  })
  it('the library pair fills in the tension; a wetting dispersed phase is warned', () => {
    const answer = runForecast(
      withFields({
        continuous: { liquid: 'n-hexadecane' },
        interfacialTension: undefined,
        surfactant: 'sorbitan-monooleate',
        contactAngle: '60 deg',
      }),
    ) as any
    expect(answer.inputs.interfacialTension.method).toBe('library-pair')
    expect(answer.entryPressure.value).toBeLessThan(0)
    expect(answer.warnings.map((w: any) => w.code)).toContain('dispersed-wets-walls')
  })
  it('step emulsification gives d ≈ 4h (Dangla et al. 2013) and flags a nozzle too narrow for its depth', () => {
    const step = runForecast(
      withFields({
        junction: { kind: 'step', mainWidth: '60 um', depth: '10 um' },
        flow: { continuous: '10 uL/min', dispersed: '0.05 uL/min' },
        model: undefined,
      }),
    ) as any
    expect(step.dropletDiameter.value).toBeCloseTo(40e-6, 12)
    expect(step.regime.value).toBe('step-emulsification')
    const narrow = runForecast(
      withFields({
        junction: { kind: 'step', mainWidth: '20 um', depth: '10 um' },
        flow: { continuous: '10 uL/min', dispersed: '0.05 uL/min' },
      }),
    ) as any
    expect(narrow.dropletDiameter.valid).toBe(false)
    expect(narrow.warnings.map((w: any) => w.code)).toContain('step-nozzle-too-narrow')
  })
  it('scaling every length by k keeps Ca at fixed speeds and scales the plug length by k (invariant)', () => {
    const k = 2
    const a = runForecast(example) as any
    const b = runForecast(
      withFields({
        junction: { kind: 't-junction', mainWidth: `${100 * k} um`, inletWidth: `${50 * k} um`, depth: `${50 * k} um` },
        flow: { continuous: `${10 * k * k} uL/min`, dispersed: `${5 * k * k} uL/min` },
      }),
    ) as any
    expect(b.capillaryNumber.value / a.capillaryNumber.value).toBeCloseTo(1, 12)
    expect(b.dropletLength.value / a.dropletLength.value).toBeCloseTo(k, 12)
    expect(b.laplacePressure.value / a.laplacePressure.value).toBeCloseTo(1 / k, 12)
  })
})

describe('bad input names the field', () => {
  it.each([
    ['negative width', { junction: { ...example.junction, mainWidth: '-100 um' } }, 'junction.mainWidth', /> 0/],
    ['non-quantity string', { junction: { ...example.junction, depth: 'deep' } }, 'junction.depth', /not a quantity/],
    ['wrong dimension', { junction: { ...example.junction, mainWidth: '5 kg' } }, 'junction.mainWidth', /not a length/],
    ['unknown liquid', { dispersed: { liquid: 'mercury' } }, 'dispersed.liquid', /unknown liquid/],
    ['missing mass fraction', { dispersed: { liquid: 'glycerol-water' } }, 'dispersed.massFraction', /massFraction/],
    ['missing flow', { flow: { continuous: '10 uL/min' } }, 'flow.dispersed', /missing/],
    ['unknown pair without tension', { interfacialTension: undefined }, 'interfacialTension', /give it/],
    ['contact angle as bare radians beyond π', { contactAngle: 150 }, 'contactAngle', /at most/],
  ])('%s', (_, patch, path, message) => {
    const issues = issuesOf(withFields(patch))
    expect(issues[0]!.path).toBe(path)
    expect(issues[0]!.message).toMatch(message)
  })
  it('a network with a floating node names the sources field and the nodes', () => {
    const issues = issuesOf({
      network: {
        channels: [
          { id: 'a', from: 'in', to: 'out', width: '100 um', depth: '50 um', length: '1 cm' },
          { id: 'b', from: 'x', to: 'y', width: '100 um', depth: '50 um', length: '1 cm' },
        ],
        sources: [
          { node: 'in', flow: '1 uL/min' },
          { node: 'out', pressure: 0 },
        ],
        liquid: { liquid: 'water' },
      },
    })
    expect(issues[0]!.path).toBe('network.sources')
    expect(issues[0]!.message).toMatch(/"x", "y"/)
  })
})

describe('network forecast', () => {
  it('two identical 1 cm channels in series need 2·Q·R, with R from the exact series', () => {
    const answer = runForecast({
      network: {
        channels: [
          { id: 'a', from: 'in', to: 'mid', width: '100 um', depth: '50 um', length: '1 cm' },
          { id: 'b', from: 'mid', to: 'out', width: '100 um', depth: '50 um', length: '1 cm' },
        ],
        sources: [
          { node: 'in', flow: '6 uL/min' },
          { node: 'out', pressure: 0 },
        ],
        liquid: { viscosity: '1 mPa*s', density: '1000 kg/m^3' },
        limits: { bondPressure: '2 bar' },
      },
    }) as any
    const r = answer.channels[0].resistance.value
    expect(answer.channels[0].resistance.method).toBe('bruus-2008-rectangular-series')
    expect(answer.inlets[0].pressure.value).toBeCloseTo(2 * r * 1e-10, 6)
    expect(answer.margins.bondPressure.ok).toBe(true)
  })
})

describe('calibration', () => {
  it('recovers α from synthetic Garstecki data and brackets it with its 95 % interval', () => {
    const w = 100e-6 as Metres
    const points = [0.2, 0.5, 1, 2].map((ratio, i) => ({
      flowRatio: ratio,
      length: w * (1 + 1.7 * ratio) * (1 + (i % 2 ? 0.01 : -0.01)),
    }))
    const fit = fitSqueezingAlpha(points, w, 50e-6 as Metres)
    expect(fit.value).toBeGreaterThan(fit.interval95[0])
    expect(fit.interval95[0]).toBeLessThan(1.7)
    expect(fit.interval95[1]).toBeGreaterThan(1.7)
    expect(Math.abs(fit.value - 1.7)).toBeLessThan(0.05)
  })
  it('exact data gives zero standard error; t(0.975, 1) = 12.706 and t(∞) → 1.96 (standard tables)', () => {
    expect(fitThroughOrigin([1, 2, 3], [2, 4, 6])).toMatchObject({ value: 2, standardError: 0 })
    expect(tQuantile975(1)).toBe(12.706)
    expect(tQuantile975(1000)).toBeCloseTo(1.962, 3)
  })
  it('a fitted α feeds the forecast through model.alpha', () => {
    const answer = runForecast(
      withFields({ model: { alpha: 1.7 }, flow: { continuous: '1 uL/min', dispersed: '1 uL/min' } }),
    ) as any
    expect(answer.dropletLength.value).toBeCloseTo(100e-6 * 2.7, 12)
  })
})
