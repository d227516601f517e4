import { describe, expect, it } from 'vitest'
import { requireChipDocument } from '#shared/schemas/chip'
import { buildOutlines } from '../../../geometry/outlines'
import { generateParallelChip } from '../../../geometry/arrays'
import { buildCompareOverlay, compareOverlay } from '../../../components/viewer/lib/compare'
import { layerStyles } from '../../../components/viewer/lib/palette'
import { buildScene, flatRing, sceneFor } from '../../../components/viewer/lib/scene'
import { loadDocumentFixture } from '../schemas/load-fixture'

const fixture = () => requireChipDocument(loadDocumentFixture('t-junction-basic.json'))

const signed = (r: Float64Array) => {
  let s = 0
  const n = r.length / 2
  for (let i = 0, j = n - 1; i < n; j = i++) s += r[2 * j]! * r[2 * i + 1]! - r[2 * i]! * r[2 * j + 1]!
  return s / 2
}

describe('scene', () => {
  it('draws the same element pieces as buildOutlines, per layer, with the chip bounds', () => {
    const doc = fixture()
    const s = buildScene(doc)
    const o = buildOutlines(doc)
    expect(s.elements.map(e => e.elementId)).toEqual(o.elements.map(e => e.elementId))
    expect(s.layers.map(l => [l.layerId, l.depth])).toEqual([['ch50', 50]])
    expect(s.bounds).toEqual({ minX: 0, minY: 0, maxX: 10000, maxY: 7000 })
    expect(s.ports.map(p => [p.id, p.radius, p.phase])).toEqual([
      ['oil-in', 375, 'continuous'],
      ['water-in', 375, 'dispersed'],
      ['out', 500, undefined],
    ])
    expect(s.texts).toEqual([{ id: 'label', text: 'DW TJ 01', x: 6500, y: 500, height: 300 }])
    expect(s.marks.length).toBe(2) // the two arms of the alignment cross
  })

  it('winds every exterior counter-clockwise so one non-zero fill draws the union without gaps', () => {
    const s = buildScene(fixture())
    for (const r of s.layers[0]!.rings) expect(signed(r)).toBeGreaterThan(0)
    const cw = flatRing(
      [
        [0, 0],
        [0, 10],
        [10, 10],
        [10, 0],
        [0, 0],
      ],
      true,
    )
    expect(Array.from(cw)).toEqual([10, 0, 10, 10, 0, 10, 0, 0]) // reversed, closing point dropped
    expect(
      signed(
        flatRing(
          [
            [0, 0],
            [10, 0],
            [10, 10],
          ],
          false,
        ),
      ),
    ).toBeLessThan(0) // a hole runs clockwise
  })

  it('is built once per document object', () => {
    const doc = fixture()
    expect(sceneFor(doc)).toBe(sceneFor(doc))
  })

  it('orders layers deepest first and shades deeper layers darker', () => {
    const s = sceneFor(generateParallelChip({ nozzles: 8 }))
    expect(s.layers.map(l => l.layerId)).toEqual(['deep', 'nozzle'])
    const styles = layerStyles([
      { id: 'a', depth: 20 },
      { id: 'b', depth: 150 },
      { id: 'c', depth: 60 },
    ])
    expect([...styles.entries()].map(([id, st]) => [id, st.family, st.shade])).toEqual([
      ['a', 'aqueous', 300],
      ['c', 'oil', 500],
      ['b', 'graphite', 600],
    ])
  })

  it('builds the 512-nozzle scene well under the time to draw', () => {
    const doc = generateParallelChip({ nozzles: 512 })
    const t0 = performance.now()
    const s = buildScene(doc)
    const ms = performance.now() - t0
    expect(s.elements.length).toBeGreaterThan(2000)
    expect(ms).toBeLessThan(1500) // measured ≈ 60–120 ms on 2 cores; buildOutlines with the union takes ≈ 1 s
  })
})

describe('compare overlay', () => {
  it('sorts geometry into added, removed and changed', () => {
    const raw = loadDocumentFixture('t-junction-basic.json')
    raw.components[0].inletWidth = 40
    raw.channels = raw.channels.filter((c: { id: string }) => c.id !== 'drops-out')
    raw.channels.push({
      id: 'drops-out-2',
      layerId: 'ch50',
      width: 80,
      points: [
        { x: 5200, y: 3000 },
        { x: 8500, y: 3000 },
      ],
    })
    raw.ports[0].feed = { phase: 'dispersed' } // not geometry: not "changed" on the overlay
    const before = fixture()
    const now = requireChipDocument(raw)
    const o = buildCompareOverlay(now, before)
    expect(o.ids).toEqual({ added: ['drops-out-2'], removed: ['drops-out'], changed: ['tj-1'] })
    expect(o.added.length).toBeGreaterThan(0)
    expect(o.removed.length).toBeGreaterThan(0)
    expect(o.changedBefore.length).toBeGreaterThan(0)
    expect(o.diff.changed).toContain('oil-in') // the table still lists it
    expect(compareOverlay(now, before)).toBe(compareOverlay(now, before))
  })

  it('marks elements on a layer whose depth changed as changed', () => {
    const raw = loadDocumentFixture('t-junction-basic.json')
    raw.layers[0].depth = 45
    const o = buildCompareOverlay(requireChipDocument(raw), fixture())
    expect(o.ids.changed.sort()).toEqual(['drops-out', 'oil-feed', 'oil-in', 'out', 'tj-1', 'water-feed', 'water-in'])
  })
})
