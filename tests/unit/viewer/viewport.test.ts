import { describe, expect, it } from 'vitest'
import {
  MAX_SCALE,
  MIN_SCALE,
  centreOn,
  fitClearOf,
  fitToBounds,
  screenBoxOf,
  panBy,
  screenPoint,
  screenToWorld,
  visibleBounds,
  worldPoint,
  worldToScreen,
  zoomAround,
} from '../../../components/viewer/lib/viewport'

const size = { width: 800, height: 600 }

describe('viewport maths', () => {
  it('flips y once: world y up is screen y down', () => {
    const v = { scale: 2, tx: 100, ty: 500 }
    expect(worldToScreen(v, worldPoint(0, 0))).toEqual({ x: 100, y: 500 })
    expect(worldToScreen(v, worldPoint(10, 10))).toEqual({ x: 120, y: 480 })
  })

  it('screenToWorld inverts worldToScreen', () => {
    const v = { scale: 0.037, tx: -12.5, ty: 713 }
    for (const [x, y] of [
      [0, 0],
      [1234.5, -77],
      [-3e4, 9e3],
    ] as const) {
      const back = screenToWorld(v, worldToScreen(v, worldPoint(x, y)))
      expect(back.x).toBeCloseTo(x, 6)
      expect(back.y).toBeCloseTo(y, 6)
    }
  })

  it('fits a 10 mm × 7 mm chip centred with the margin on the limiting side', () => {
    const v = fitToBounds({ minX: 0, minY: 0, maxX: 10000, maxY: 7000 }, size, 20)
    expect(v.scale).toBeCloseTo(760 / 10000, 12) // width limits: (800 − 2·20) px / 10 000 µm
    const lowerLeft = worldToScreen(v, worldPoint(0, 0))
    const upperRight = worldToScreen(v, worldPoint(10000, 7000))
    expect(lowerLeft.x).toBeCloseTo(20, 9)
    expect(upperRight.x).toBeCloseTo(780, 9)
    expect((lowerLeft.y + upperRight.y) / 2).toBeCloseTo(300, 9) // centred vertically
    expect(upperRight.y).toBeLessThan(lowerLeft.y) // y up
  })

  it('fits degenerate bounds to a finite view', () => {
    const v = fitToBounds({ minX: 5, minY: 5, maxX: 5, maxY: 5 }, size)
    expect(Number.isFinite(v.scale) && Number.isFinite(v.tx) && Number.isFinite(v.ty)).toBe(true)
    expect(v.scale).toBeLessThanOrEqual(MAX_SCALE)
  })

  it('zooms around the cursor: the world point under it stays put', () => {
    const v = { scale: 0.1, tx: 40, ty: 560 }
    const at = screenPoint(333, 222)
    const before = screenToWorld(v, at)
    const z = zoomAround(v, 2.5, at)
    expect(z.scale).toBeCloseTo(0.25, 12)
    const after = worldToScreen(z, before)
    expect(after.x).toBeCloseTo(333, 9)
    expect(after.y).toBeCloseTo(222, 9)
  })

  it('clamps zoom to its limits and still keeps the anchor', () => {
    const at = screenPoint(10, 10)
    const z = zoomAround({ scale: MAX_SCALE / 2, tx: 0, ty: 0 }, 100, at)
    expect(z.scale).toBe(MAX_SCALE)
    expect(zoomAround({ scale: MIN_SCALE * 2, tx: 0, ty: 0 }, 1e-6, at).scale).toBe(MIN_SCALE)
  })

  it('pans, centres and reports what is visible', () => {
    const v = panBy({ scale: 1, tx: 0, ty: 600 }, 10, -5)
    expect(v).toEqual({ scale: 1, tx: 10, ty: 595 })
    const c = centreOn({ scale: 0.5, tx: 0, ty: 0 }, worldPoint(1000, 2000), size)
    expect(worldToScreen(c, worldPoint(1000, 2000))).toEqual({ x: 400, y: 300 })
    expect(visibleBounds({ scale: 1, tx: 0, ty: 600 }, size)).toEqual({ minX: 0, minY: 0, maxX: 800, maxY: 600 })
  })
})

describe('fitClearOf: the chip never under the layer panel in the corner', () => {
  const vp = { width: 560, height: 390 }
  const panel = { width: 245, height: 95 }
  const inside = (box: { x: number; y: number; width: number; height: number }) => [
    box.x >= 0,
    box.y >= 0,
    box.x + box.width <= vp.width,
    box.y + box.height <= vp.height,
  ]
  const clear = (box: { x: number; y: number }) => box.x >= panel.width || box.y >= panel.height

  it('a tall chip (the 64-nozzle array, 7.55 × 11.78 mm) moves beside the panel at nearly the plain scale', () => {
    const b = { minX: -2000, minY: -2000, maxX: 5550, maxY: 9780 }
    const plain = fitToBounds(b, vp, 24)
    expect(clear(screenBoxOf(plain, b))).toBe(false) // the plain fit puts its top-left corner under the panel
    const v = fitClearOf(b, vp, 24, panel)
    const box = screenBoxOf(v, b)
    expect(clear(box)).toBe(true)
    expect(inside(box)).toEqual([true, true, true, true])
    expect(box.x).toBeCloseTo(panel.width + (vp.width - panel.width - box.width) / 2, 6)
    expect(v.scale).toBeCloseTo(plain.scale, 9) // height-limited either way
  })

  it('a wide chip (10 × 7 mm) goes below the panel, whole and inside the margin', () => {
    const b = { minX: 0, minY: 0, maxX: 10000, maxY: 7000 }
    const v = fitClearOf(b, { width: 640, height: 440 }, 24, { width: 150, height: 70 })
    const box = screenBoxOf(v, b)
    expect(box.y).toBeGreaterThanOrEqual(70 + 24 - 1e-9)
    expect(box.y + box.height).toBeLessThanOrEqual(440 - 24 + 1e-9)
    expect(box.x).toBeGreaterThanOrEqual(24 - 1e-9)
    expect(v.scale).toBeCloseTo(Math.max((440 - 70 - 48) / 7000, (640 - 150 - 48) / 10000), 9)
  })

  it('keeps the plain fit when the chip misses the panel, or with no panel', () => {
    const b = { minX: 0, minY: 0, maxX: 1000, maxY: 10000 }
    expect(fitClearOf(b, vp, 24, { width: 100, height: 40 })).toEqual(fitToBounds(b, vp, 24))
    expect(fitClearOf(b, vp, 24, null)).toEqual(fitToBounds(b, vp, 24))
  })
})
