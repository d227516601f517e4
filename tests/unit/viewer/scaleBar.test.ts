import { describe, expect, it } from 'vitest'
import { formatCoordinate, formatLength, niceScaleBar } from '../../../components/viewer/lib/scaleBar'

describe('niceScaleBar', () => {
  it.each([
    // px per µm, room px, expected length µm, label
    [1, 120, 100, '100 µm'],
    [1, 99, 50, '50 µm'],
    [0.12, 150, 1000, '1 mm'],
    [0.076, 150, 1000, '1 mm'],
    [0.05, 150, 2000, '2 mm'],
    [0.01, 150, 10000, '10 mm'],
    [20, 150, 5, '5 µm'],
    [400, 150, 0.2, '200 nm'],
  ])('at %f px/µm in %i px shows %f µm', (scale, room, len, label) => {
    const bar = niceScaleBar(scale, room)
    expect(bar.lengthUm).toBeCloseTo(len, 9)
    expect(bar.label).toBe(label)
    expect(bar.px).toBeCloseTo(len * scale, 9)
    expect(bar.px).toBeLessThanOrEqual(room)
  })

  it('always picks 1, 2 or 5 times a power of ten and uses at least 40 % of the room', () => {
    for (let s = 1e-4; s < 200; s *= 1.37) {
      const bar = niceScaleBar(s, 160)
      const mantissa = bar.lengthUm / 10 ** Math.floor(Math.log10(bar.lengthUm) + 1e-9)
      expect([1, 2, 5].some(m => Math.abs(mantissa - m) < 1e-6)).toBe(true)
      expect(bar.px).toBeGreaterThanOrEqual(0.4 * 160)
      expect(bar.px).toBeLessThanOrEqual(160 + 1e-9)
    }
  })

  it('says what is wrong with a bad scale', () => {
    expect(() => niceScaleBar(0, 100)).toThrow(/px per µm \(got 0\)/)
    expect(() => niceScaleBar(1, -1)).toThrow(/> 0 px/)
  })
})

describe('length and coordinate text', () => {
  it('carries a unit', () => {
    expect(formatLength(50)).toBe('50 µm')
    expect(formatLength(1500)).toBe('1.5 mm')
    expect(formatLength(0.5)).toBe('500 nm')
  })
  it('shows as many decimals as a pixel resolves', () => {
    expect(formatCoordinate(1234.5678, 0.05)).toBe('1235 µm') // 20 µm per px
    expect(formatCoordinate(1234.5678, 3)).toBe('1234.6 µm') // 0.33 µm per px
    expect(formatCoordinate(-0.0001, 1)).toBe('0 µm')
  })
})
