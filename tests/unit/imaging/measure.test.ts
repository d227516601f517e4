// Synthetic micrographs with known droplet diameters (noise, blur, uneven illumination, touching drops) must come
// back within 2 % on the mean diameter and 1 percentage point on the CV, with the count exact for separated drops.
import { describe, expect, it } from 'vitest'
import { excludeDrops, measureDrops } from '../../../shared/imaging/measure'
import { renderMicrograph, scatterDrops } from '../../../shared/imaging/synthetic'
import { describeSample } from '../../../shared/physics/calibration/stats'

const cases = [
  {
    name: 'clean, 30 px drops',
    size: 768,
    count: 60,
    d: 30,
    cv: 0.03,
    noise: 2,
    blur: 0.5,
    unevenness: 0,
    touching: 0,
  },
  {
    name: 'noisy, blurred, uneven light',
    size: 1024,
    count: 120,
    d: 36,
    cv: 0.05,
    noise: 8,
    blur: 1.2,
    unevenness: 0.4,
    touching: 0,
  },
  {
    name: 'touching pairs among separated drops',
    size: 1024,
    count: 100,
    d: 40,
    cv: 0.04,
    noise: 5,
    blur: 1,
    unevenness: 0.3,
    touching: 6,
  },
  {
    name: 'smaller drops, 24 px',
    size: 640,
    count: 80,
    d: 24,
    cv: 0.06,
    noise: 4,
    blur: 0.7,
    unevenness: 0.2,
    touching: 0,
  },
]

describe('measureDrops on synthetic micrographs', () => {
  for (const c of cases) {
    it(c.name, () => {
      const { separated, touching } = scatterDrops({
        width: c.size,
        height: c.size,
        count: c.count,
        meanDiameter: c.d,
        cv: c.cv,
        touching: c.touching,
        seed: c.count,
      })
      const image = renderMicrograph({
        width: c.size,
        height: c.size,
        drops: [...separated, ...touching],
        noise: c.noise,
        blur: c.blur,
        unevenness: c.unevenness,
        seed: c.count,
      })
      const umPerPx = 0.8
      const result = measureDrops(image, { umPerPx })
      const truth = describeSample(separated.map(s => s.diameter * umPerPx))
      const accepted = result.drops.filter(d => d.accepted)
      expect(accepted.length).toBe(separated.length)
      expect(Math.abs(result.summary!.mean - truth.mean) / truth.mean).toBeLessThan(0.02)
      expect(Math.abs(result.summary!.cv - truth.cv)).toBeLessThan(0.01)
      // every touching pair is found and rejected as not round, never counted as one big drop
      expect(result.drops.filter(d => d.reason === 'not-round').length).toBe(touching.length / 2)
    })
  }

  it('rejects drops cut by the image edge', () => {
    const image = renderMicrograph({
      width: 200,
      height: 200,
      drops: [
        { x: 100, y: 100, diameter: 40 },
        { x: 5, y: 60, diameter: 40 },
      ],
      noise: 2,
    })
    const result = measureDrops(image, { umPerPx: 1 })
    expect(result.drops.map(d => d.reason ?? 'ok').sort()).toEqual(['edge', 'ok'])
  })

  it("takes the user's exclusions out of the distribution and can put them back", () => {
    const { separated } = scatterDrops({ width: 400, height: 400, count: 10, meanDiameter: 30, cv: 0.05 })
    const result = measureDrops(renderMicrograph({ width: 400, height: 400, drops: separated }), { umPerPx: 1 })
    const out = excludeDrops(result, [result.drops[0]!.id])
    expect(out.summary!.count).toBe(9)
    expect(out.drops[0]!.reason).toBe('excluded')
    expect(excludeDrops(out, []).summary!.count).toBe(10)
  })

  it('refuses a scale that is not > 0', () => {
    expect(() => measureDrops({ width: 2, height: 2, data: new Uint8Array(4) }, { umPerPx: 0 })).toThrow(
      /Scale must be > 0 µm per pixel/,
    )
  })
})
