import { describe, expect, it } from 'vitest'
import {
  circularResistance,
  poiseuilleNumber,
  rectangularResistance,
  rectangularResistanceApprox,
} from '#shared/physics/hydraulics/resistance'
import type { Metres, PascalSeconds } from '#shared/physics/units'

const m = (x: number) => x as Metres
const eta = 1e-3 as PascalSeconds

describe('rectangular channel resistance, exact series (Bruus 2008 eqs. 4.37–4.38)', () => {
  // Shah & London 1978, Laminar Flow Forced Convection in Ducts, Table 43: Darcy fRe to 4 significant figures.
  it.each([
    [1, 56.91],
    [0.5, 62.19],
    [0.25, 72.93],
    [0.125, 82.34],
  ])('aspect %f → fRe = %f (Shah & London), within 0.01 %', (aspect, fRe) => {
    expect(Math.abs(poiseuilleNumber(m(1), m(aspect)) / fRe - 1)).toBeLessThan(1e-4)
  })
  it('tends to the parallel-plate value 96 as the aspect ratio goes to 0 (Shah & London), within 0.2 %', () => {
    expect(Math.abs(poiseuilleNumber(m(1), m(0.001)) / 96 - 1)).toBeLessThan(2e-3)
  })
  it('square channel R = 28.45 ηL/h⁴ (Bruus 2008, Table 4.1 gives 28.4)', () => {
    expect(rectangularResistance(eta, m(1), m(1), m(1)) / 1e-3).toBeCloseTo(28.45, 2)
  })
  it('is symmetric in width and depth', () => {
    expect(rectangularResistance(eta, m(0.01), m(100e-6), m(30e-6))).toBe(
      rectangularResistance(eta, m(0.01), m(30e-6), m(100e-6)),
    )
  })
  it('scales as 1/k³ when every length is scaled by k (invariant)', () => {
    const base = rectangularResistance(eta, m(0.01), m(100e-6), m(40e-6))
    for (const k of [0.5, 2, 10]) {
      expect((rectangularResistance(eta, m(0.01 * k), m(100e-6 * k), m(40e-6 * k)) * k ** 3) / base).toBeCloseTo(1, 12)
    }
  })
})

describe("Bruus's approximation", () => {
  it('overestimates by about 13–14 % at h = w (Bruus 2008 states 13 %), and < 0.2 % for h/w ≤ 0.5', () => {
    const error = (aspect: number) =>
      rectangularResistanceApprox(eta, m(1), m(1), m(aspect)) / rectangularResistance(eta, m(1), m(1), m(aspect)) - 1
    expect(error(1)).toBeGreaterThan(0.12)
    expect(error(1)).toBeLessThan(0.141)
    for (const aspect of [0.5, 0.25, 0.1, 0.01]) expect(Math.abs(error(aspect))).toBeLessThan(2e-3)
  })
})

describe('Hagen–Poiseuille', () => {
  it('R = 128ηL/(πD⁴): 1 m of 0.5 mm tubing with water ≈ 6.52e11 Pa·s/m³ (hand calculation)', () => {
    expect(circularResistance(eta, m(1), m(0.5e-3)) / (128e-3 / (Math.PI * 0.5e-3 ** 4))).toBeCloseTo(1, 12)
    expect(circularResistance(eta, m(1), m(0.5e-3))).toBeCloseTo(6.519e11, -9)
  })
})
