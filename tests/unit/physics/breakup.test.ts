// Breakup beyond squeezing (shared/physics/forecast/size.ts, junction/regime.ts): the size-vs-Ca curve bends
// through transition and dripping, continuous with the squeezing law; the regime rules from Christopher 2008.
import { describe, expect, it } from 'vitest'
import { sweepCapillary } from '#shared/editor/sweep'
import { runForecast, type JunctionForecast } from '#shared/physics/forecast'
import { classifyRegime, isJetting, NO_SQUEEZING_RATIO } from '#shared/physics/junction/regime'
import { DRIPPING_EXPONENT, drippingLength } from '#shared/physics/junction/tJunction'
import type { Metres } from '#shared/physics/units'

const tj = (continuous: string, dispersed: string, patch: Record<string, unknown> = {}) =>
  runForecast({
    junction: { kind: 't-junction', mainWidth: '100 um', inletWidth: '50 um', depth: '50 um' },
    continuous: { viscosity: '3 mPa*s', density: '800 kg/m^3' },
    dispersed: { viscosity: '3 mPa*s', density: '1000 kg/m^3' },
    interfacialTension: '5 mN/m',
    flow: { continuous, dispersed },
    model: { alpha: 1 },
    ...patch,
  }) as JunctionForecast

describe('T-junction size against Ca', () => {
  it("the plot's sweep is flat in squeezing and bends down through transition and dripping", () => {
    const base = tj('1 uL/min', '0.5 uL/min') // Ca = 0.002
    const points = sweepCapillary(base, 40)
    const squeezing = points.filter(p => p.x < 0.01)
    const beyond = points.filter(p => p.x > 0.01)
    expect(squeezing.length).toBeGreaterThan(5)
    expect(beyond.length).toBeGreaterThan(5)
    for (const p of squeezing) expect(p.diameterUm).toBeCloseTo(squeezing[0]!.diameterUm, 9)
    for (let i = 1; i < beyond.length; i++) expect(beyond[i]!.diameterUm).toBeLessThan(beyond[i - 1]!.diameterUm)
    expect(beyond.at(-1)!.diameterUm).toBeLessThan(0.95 * squeezing[0]!.diameterUm)
    expect(beyond.map(p => p.regime)).toEqual(expect.arrayContaining(['transition', 'dripping']))
    expect(beyond.every(p => !p.valid)).toBe(true)
  })
  it('is continuous with the squeezing law at Ca = 0.01 and falls as Ca^(−0.2) beyond (length)', () => {
    const l = 150e-6 as Metres
    expect(drippingLength(l, 0.01)).toBe(l)
    expect(drippingLength(l, 0.1) / l).toBeCloseTo(10 ** -DRIPPING_EXPONENT, 12)
    // Through the API: Ca 0.05 (5× the anchor) gives 5^(−0.2) of the squeezing length, Garstecki L = w(1 + α φ).
    const f = tj('25 uL/min', '12.5 uL/min')
    expect(f.capillaryNumber.value).toBeCloseTo(0.05, 12)
    expect(f.dropletLength!.value).toBeCloseTo(150e-6 * 5 ** -0.2, 12)
    expect(f.warnings.map(w => w.code)).toContain('dripping-law-indicative')
  })
  it('a dispersed phase 1/50 as viscous or less has no pure squeezing regime (Christopher et al. 2008, Phys. Rev. E 78, 036317)', () => {
    expect(classifyRegime('t-junction', 0.002, 0, 1).value).toBe('squeezing')
    expect(classifyRegime('t-junction', 0.002, 0, NO_SQUEEZING_RATIO * 0.9).value).toBe('transition')
    const f = tj('1 uL/min', '0.5 uL/min', {
      continuous: { viscosity: '100 mPa*s', density: '960 kg/m^3' },
      dispersed: { liquid: 'water' },
      flow: { continuous: '0.03 uL/min', dispersed: '0.015 uL/min' },
    })
    expect(f.viscosityRatio.value).toBeLessThan(1 / 50)
    expect(f.capillaryNumber.value).toBeLessThan(0.01)
    expect(f.regime.value).toBe('transition')
    expect(f.dropletVolume.valid).toBe(false)
  })
})

describe('flow-focusing past squeezing', () => {
  it('drop volume falls as Ca^(−1) past Ca 0.01 (d ∝ Ca^(−1/3), Cubaud & Mason 2008)', () => {
    const ff = (scale: number) =>
      runForecast({
        junction: { kind: 'flow-focusing', mainWidth: '50 um', depth: '50 um' },
        continuous: { viscosity: '3 mPa*s', density: '800 kg/m^3' },
        dispersed: { liquid: 'water' },
        interfacialTension: '5 mN/m',
        flow: { continuous: (scale * 1e-9) / 60, dispersed: (scale * 0.25e-9) / 60 },
      }) as JunctionForecast
    const a = ff(4),
      b = ff(8) // Ca 0.016 and 0.032
    expect(a.capillaryNumber.value).toBeGreaterThan(0.01)
    expect(b.dropletVolume.value / a.dropletVolume.value).toBeCloseTo(
      a.capillaryNumber.value / b.capillaryNumber.value,
      9,
    )
    expect(b.dropletVolume.valid).toBe(false)
  })
})

describe("band edges and the window's jetting test", () => {
  it('isJetting agrees with classifyRegime everywhere, edges included', () => {
    for (const kind of ['t-junction', 'flow-focusing', 'step'] as const) {
      for (const ca of [0, 0.005, 0.01, 0.02, 0.03, 0.030000000000000002, 0.1, 0.7, 1.3, 1.3000000000000003, 2]) {
        for (const we of [0, 0.1, 0.6, 0.7, 1, 1.3, 5])
          expect(isJetting(kind, ca, we), `${kind} ${ca} ${we}`).toBe(classifyRegime(kind, ca, we).value === 'jetting')
      }
    }
  })
  it('a band edge computed a few ulps off stays inside the band (0.02 → transition, 0.01 → transition)', () => {
    expect(classifyRegime('t-junction', 0.020000000000000004, 0).value).toBe('transition')
    expect(classifyRegime('t-junction', 0.009999999999999998, 0).value).toBe('transition')
    expect(classifyRegime('t-junction', 0.0201, 0).value).toBe('dripping')
  })
})
