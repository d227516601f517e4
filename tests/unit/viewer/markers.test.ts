import { describe, expect, it } from 'vitest'
import {
  calloutSize,
  findingAt,
  layoutCallouts,
  overlaps,
  pinAt,
  pinBox,
  placeFindings,
  placePins,
  type ViewerLabel,
} from '../../../components/viewer/lib/markers'

const view = { scale: 0.1, tx: 0, ty: 600 } // 10 µm per px, world origin at the lower-left of 800 × 600
const size = { width: 800, height: 600 }
const label = (id: string, x: number, y: number): ViewerLabel => ({
  elementId: id,
  x,
  y,
  lines: ['dripping', 'd 41 µm'],
  tone: 'ok',
})

describe('callout layout', () => {
  it('sizes a callout from its longest line in JetBrains Mono', () => {
    expect(calloutSize(['d 41 µm', 'squeezing'])).toEqual({ w: Math.ceil(9 * 6.6 + 12), h: 2 * 14 + 8 })
  })
  it('places a lone callout to the upper right of its junction', () => {
    const { placed, hidden } = layoutCallouts([label('tj', 2000, 3000)], view, size)
    expect(hidden).toBe(0)
    expect(placed[0]!.ax).toBeCloseTo(200)
    expect(placed[0]!.ay).toBeCloseTo(300)
    expect(placed[0]!.box.x).toBeGreaterThan(200)
    expect(placed[0]!.box.y + placed[0]!.box.h).toBeLessThan(300)
  })
  it('never overlaps two callouts; the ones with no room are counted as hidden', () => {
    const many = Array.from({ length: 200 }, (_, i) =>
      label(`n${i}`, 300 + (i % 20) * 300, 600 + Math.floor(i / 20) * 300),
    )
    const { placed, hidden } = layoutCallouts(many, view, size)
    expect(placed.length + hidden).toBe(200)
    expect(hidden).toBeGreaterThan(150)
    for (let i = 0; i < placed.length; i++)
      for (let j = i + 1; j < placed.length; j++) expect(overlaps(placed[i]!.box, placed[j]!.box)).toBe(false)
  })
  it('gives way to the geometry: a callout never covers another junction', () => {
    const row = Array.from({ length: 50 }, (_, i) => label(`n${i}`, 3000, 1000 + i * 20)) // junctions 2 px apart
    expect(layoutCallouts(row, view, size)).toMatchObject({ placed: [], hidden: 50 })
    const sparse = Array.from({ length: 10 }, (_, i) => label(`n${i}`, 3000, 500 + i * 450)) // 45 px apart
    const { placed } = layoutCallouts(sparse, view, size)
    expect(placed.length).toBeGreaterThan(5)
    for (const c of placed)
      for (const l of sparse) {
        const a = { x: l.x * 0.1, y: 600 - l.y * 0.1 }
        if (a.x !== c.ax || a.y !== c.ay)
          expect(
            a.x > c.box.x - 5 && a.x < c.box.x + c.box.w + 5 && a.y > c.box.y - 5 && a.y < c.box.y + c.box.h + 5,
          ).toBe(false)
      }
  })
  it('keeps callouts off pins and skips junctions outside the viewport', () => {
    const pins = placePins([{ id: 'p', x: 2200, y: 3300, index: 1, resolved: false }], view)
    const { placed } = layoutCallouts(
      [label('tj', 2000, 3000), label('far', -5000, 3000)],
      view,
      size,
      pins.map(pinBox),
    )
    expect(placed).toHaveLength(1)
    expect(overlaps(placed[0]!.box, pinBox(pins[0]!))).toBe(false)
  })
})

describe('marker hits', () => {
  it('finds the pin head and the finding under the cursor', () => {
    const pins = placePins(
      [
        { id: 'a', x: 1000, y: 1000, index: 1, resolved: false },
        { id: 'b', x: 1010, y: 1000, index: 2, resolved: true },
      ],
      view,
    )
    expect(pinAt(pins, pins[0]!.cx, pins[0]!.cy)?.id).toBe('b') // the one drawn last is on top
    expect(pinAt(pins, 0, 0)).toBeNull()
    const f = placeFindings([{ id: 'f', severity: 'error', x: 4000, y: 1000, message: 'Gap 12 µm < 20 µm' }], view)
    expect(findingAt(f, 401, 501)?.id).toBe('f')
    expect(findingAt(f, 420, 500)).toBeNull()
  })
})
