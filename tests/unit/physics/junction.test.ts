import { describe, expect, it } from 'vitest'
import { capillaryInertialSpeed, mergedRadius, releasedSurfaceEnergy } from '#shared/physics/junction/coalescence'
import { entryBarrier, laplacePlug, laplaceSphere } from '#shared/physics/junction/laplace'
import {
  minimumPlugVolume,
  plugLength,
  plugVolume,
  sphereEquivalentDiameter,
} from '#shared/physics/junction/plugVolume'
import { classifyRegime } from '#shared/physics/junction/regime'
import { stepDiameter } from '#shared/physics/junction/step'
import { garsteckiLength, vanSteijnAlpha, vanSteijnFillVolume } from '#shared/physics/junction/tJunction'
import type { Metres, NewtonsPerMetre, Radians } from '#shared/physics/units'

const m = (x: number) => x as Metres
const N = (x: number) => x as NewtonsPerMetre

describe('coalescence of two equal drops', () => {
  it('merge into one of radius ≈ 1.26 r (common practice, no source; exact 2^(1/3))', () => {
    expect(mergedRadius(m(10e-6)) / 10e-6).toBeCloseTo(1.26, 2)
  })
  it('release 4πγr²(2 − 2^(2/3)) — equal to the area difference computed directly', () => {
    const r = 20e-6
    const direct = 0.005 * (2 * 4 * Math.PI * r ** 2 - 4 * Math.PI * mergedRadius(m(r)) ** 2)
    expect(releasedSurfaceEnergy(N(0.005), m(r)) / direct).toBeCloseTo(1, 12)
  })
  it('capillary–inertial speed of a 20 µm water drop at 5 mN/m is ≈ 0.5 m/s (hand calculation)', () => {
    expect(capillaryInertialSpeed(N(0.005), 1000 as never, m(20e-6))).toBeCloseTo(0.5, 6)
  })
})

describe('Young–Laplace', () => {
  it('a 100 × 50 µm plug at 5 mN/m: Mayer–Stowe–Princen 284.94 Pa (by hand from (4 − π) r² − 2(w + h) r + wh = 0), below the gutter-free 2γ(1/w + 1/h) = 300 Pa', () => {
    // r = [300e-6 − √(9e-8 − 4 (4 − π) 5e-9)] / (2 (4 − π)) = 17.548 µm; γ/r = 284.94 Pa.
    const r = (300e-6 - Math.sqrt(9e-8 - 4 * (4 - Math.PI) * 5e-9)) / (2 * (4 - Math.PI))
    expect(laplacePlug(N(0.005), m(100e-6), m(50e-6))).toBeCloseTo(0.005 / r, 9)
    expect(laplacePlug(N(0.005), m(100e-6), m(50e-6))).toBeCloseTo(284.94, 2)
    expect(laplacePlug(N(0.005), m(100e-6), m(50e-6))).toBeLessThan(300)
    expect(laplaceSphere(N(0.005), m(50e-6))).toBeCloseTo(200, 9)
  })
  it('square duct: Δp a/γ = 2[cos θ + √(π/4 − θ + sin θ cos θ)], the published closed form (Legait 1983; Ma, Mason & Morrow 1996, Colloids Surf. A 117, 273); 2 + √π at θ = 0', () => {
    const a = 50e-6
    expect((laplacePlug(N(0.005), m(a), m(a)) * a) / 0.005).toBeCloseTo(2 + Math.sqrt(Math.PI), 10)
    for (const wettingDeg of [0, 10, 20, 30, 40]) {
      const t = (wettingDeg * Math.PI) / 180
      const published = 2 * (Math.cos(t) + Math.sqrt(Math.PI / 4 - t + Math.sin(t) * Math.cos(t)))
      expect((entryBarrier(N(0.005), (Math.PI - t) as Radians, m(a), m(a)) * a) / 0.005).toBeCloseTo(published, 9)
    }
  })
  it('entry barrier is positive for a non-wetting dispersed phase, continuous at 135°, zero at 90°, negative when it wets', () => {
    const barrier = (deg: number) => entryBarrier(N(0.005), ((deg * Math.PI) / 180) as Radians, m(50e-6), m(50e-6))
    // Below 135° the corners hold no continuous phase: −2γ cos θ (2/a); at 120°: 2·0.005·0.5·(2/50e-6) by hand.
    expect(barrier(120)).toBeCloseTo((0.005 * 2) / 50e-6, 6)
    expect(Math.abs(barrier(135.0001) - barrier(134.9999))).toBeLessThan(1e-2)
    expect(barrier(150)).toBeGreaterThan(barrier(135))
    expect(Math.abs(barrier(90))).toBeLessThan(1e-9)
    expect(barrier(60)).toBeLessThan(0)
  })
})

describe('confined plug volume (Musterd et al. 2015)', () => {
  it('reduces to a sphere of diameter h for L = w = h', () => {
    expect(plugVolume(m(1), m(1), m(1)) / ((Math.PI / 6) * 1)).toBeCloseTo(1, 12)
  })
  it('body of a square channel keeps gutters of the Mayer–Stowe–Princen radius a/(2 + √π), not a/2 (Wong, Radke & Morris 1995)', () => {
    const r = 1 / (2 + Math.sqrt(Math.PI))
    expect((plugVolume(m(3), m(1), m(1)) - plugVolume(m(1), m(1), m(1))) / 2).toBeCloseTo(
      1 - (4 - Math.PI) * r ** 2,
      12,
    )
  })
  it("flat channels (h ≪ w) keep Musterd's gutters of radius h/2: body area within 0.2 % of hw − (1 − π/4)h² at h/w = 0.05", () => {
    const w = 1,
      h = 0.05
    const body = plugVolume(m(3), m(w), m(h)) - plugVolume(m(2), m(w), m(h))
    expect(Math.abs(body / (w * h - (1 - Math.PI / 4) * h ** 2) - 1)).toBeLessThan(2e-3)
  })
  it('a deep narrow channel (depth 200 µm > width 50 µm) never gives a negative volume: short drops are discs, then spheres, continuous at the joins', () => {
    const w = m(50e-6),
      h = m(200e-6)
    for (const length of [10e-6, 49e-6, 50e-6, 51e-6, 60e-6, 120e-6, 199e-6, 200e-6, 201e-6, 400e-6]) {
      const v = plugVolume(m(length), w, h)
      expect(v).toBeGreaterThan(0)
      expect(plugLength(v, w, h) / length).toBeCloseTo(1, 9)
    }
    for (const join of [50e-6, 200e-6]) {
      expect(plugVolume(m(join * (1 - 1e-9)), w, h) / plugVolume(m(join * (1 + 1e-9)), w, h)).toBeCloseTo(1, 6)
    }
  })
  it('is below the full rectangular volume h·w·L and inverts exactly', () => {
    const v = plugVolume(m(300e-6), m(100e-6), m(40e-6))
    expect(v).toBeLessThan(300e-6 * 100e-6 * 40e-6)
    expect(plugLength(v, m(100e-6), m(40e-6)) / 300e-6).toBeCloseTo(1, 12)
    expect(minimumPlugVolume(m(100e-6), m(40e-6))).toBeCloseTo(plugVolume(m(100e-6), m(100e-6), m(40e-6)), 20)
  })
  it('sphere-equivalent diameter of a 1 pL drop is 12.41 µm (hand calculation)', () => {
    expect(sphereEquivalentDiameter(1e-15 as never) * 1e6).toBeCloseTo(12.407, 3)
  })
})

describe('T-junction squeezing (Garstecki 2006; van Steijn 2010)', () => {
  it('L/w = 1 + α Qd/Qc', () => {
    expect(garsteckiLength(m(100e-6), 1, 0.5) / 100e-6).toBeCloseTo(1.5, 12)
  })
  it('van Steijn fill volume for win ≤ w is 3π/8 − (π/2)(1 − π/4)h/w (their eq. 4); continuous at win = w', () => {
    expect(vanSteijnFillVolume(m(1), m(0.5), m(1 / 3))).toBeCloseTo(
      (3 * Math.PI) / 8 - ((Math.PI / 2) * (1 - Math.PI / 4)) / 3,
      12,
    )
    expect(vanSteijnFillVolume(m(1), m(1.000001), m(0.3))).toBeCloseTo(vanSteijnFillVolume(m(1), m(1), m(0.3)), 4)
  })
  it('α grows with the inlet width and lies between 0.2 and 8 in the range of their Fig. 3 (h/w ≤ 0.5, 1/3 ≤ win/w ≤ 3)', () => {
    const alphas = [1 / 3, 2 / 3, 1, 4 / 3, 2, 3].map(r => vanSteijnAlpha(m(1), m(r), m(1 / 3)))
    for (let i = 1; i < alphas.length; i++) expect(alphas[i]!).toBeGreaterThan(alphas[i - 1]!)
    for (const a of alphas) {
      expect(a).toBeGreaterThan(0.2)
      expect(a).toBeLessThan(8)
    }
  })
})

describe('breakup regime', () => {
  it('T-junction: squeezing below Ca 0.01, transition band around De Menech’s 0.015, dripping above 0.02', () => {
    expect(classifyRegime('t-junction', 0.005, 0).value).toBe('squeezing')
    const mid = classifyRegime('t-junction', 0.015, 0)
    expect(mid.value).toBe('transition')
    expect(mid.between).toEqual(['squeezing', 'dripping'])
    expect(classifyRegime('t-junction', 0.05, 0).value).toBe('dripping')
  })
  it('jetting when Ca + We passes ≈ 1 (Utada et al. 2007), with a band', () => {
    expect(classifyRegime('t-junction', 0.05, 2).value).toBe('jetting')
    expect(classifyRegime('t-junction', 0.05, 0.9).value).toBe('transition')
  })
  it('flow-focusing thresholds are marked indicative (valid false)', () => {
    expect(classifyRegime('flow-focusing', 0.005, 0).valid).toBe(false)
    expect(classifyRegime('t-junction', 0.005, 0).valid).toBe(true)
  })
})

describe('step emulsification against measured sizes', () => {
  // Shui, van den Berg & Eijkel 2011, Microfluid. Nanofluid. 11, 87 (abstract): nanochannels 100–900 nm deep gave
  // droplets 0.4–3.5 µm across, set by the channel depth alone (independent of flows, surfactant and viscosity).
  // d = 4h lands within 5 % of both ends of that range (the tolerance: common practice, no source).
  for (const [depthNm, measuredUm] of [
    [100, 0.4],
    [900, 3.5],
  ] as const)
    it(`a ${depthNm} nm deep nozzle: ${measuredUm} µm measured, d = 4h within 5 %`, () => {
      const predictedUm = stepDiameter(m(depthNm * 1e-9)) * 1e6
      expect(Math.abs(predictedUm - measuredUm) / measuredUm).toBeLessThan(0.05)
    })
})
