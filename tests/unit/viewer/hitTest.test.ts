import { describe, expect, it } from 'vitest'
import { requireChipDocument } from '#shared/schemas/chip'
import { generateParallelChip } from '../../../geometry/arrays'
import {
  buildElementIndex,
  distanceToPolygon,
  hitTest,
  pointInPolygon,
  polygonArea,
} from '../../../components/viewer/lib/hitTest'
import { sceneFor } from '../../../components/viewer/lib/scene'
import { loadDocumentFixture } from '../schemas/load-fixture'

const square = (x0: number, y0: number, s: number) =>
  [
    [x0, y0],
    [x0 + s, y0],
    [x0 + s, y0 + s],
    [x0, y0 + s],
  ] as [number, number][]

describe('point in polygon', () => {
  it('respects holes', () => {
    const ring = [square(0, 0, 10), square(3, 3, 4).reverse()]
    expect(pointInPolygon(1, 1, ring)).toBe(true)
    expect(pointInPolygon(5, 5, ring)).toBe(false)
    expect(pointInPolygon(11, 5, ring)).toBe(false)
    expect(polygonArea(ring)).toBeCloseTo(100 - 16, 9)
  })
  it('measures distance from outside and is 0 inside', () => {
    expect(distanceToPolygon(13, 14, [square(0, 0, 10)])).toBeCloseTo(5, 9)
    expect(distanceToPolygon(5, 5, [square(0, 0, 10)])).toBe(0)
  })
})

describe('hitTest on the T-junction fixture', () => {
  const scene = sceneFor(requireChipDocument(loadDocumentFixture('t-junction-basic.json')))

  it('finds the channel, the junction and the port under a point', () => {
    expect(hitTest(scene.index, 3000, 3010)).toBe('oil-feed')
    expect(hitTest(scene.index, 5000, 3000)).toBe('tj-1') // the junction beats the channels that end in it
    expect(hitTest(scene.index, 8500, 3300)).toBe('out') // inside the 1000 µm punch, off the channel
    expect(hitTest(scene.index, 3000, 3200)).toBeNull()
  })
  it('accepts a near miss within the tolerance, and filters hidden layers', () => {
    expect(hitTest(scene.index, 3000, 3080, { toleranceUm: 40 })).toBe('oil-feed') // 30 µm above a 100 µm channel
    expect(hitTest(scene.index, 3000, 3080, { toleranceUm: 20 })).toBeNull()
    expect(hitTest(scene.index, 3000, 3010, { layerIds: new Set(['other']) })).toBeNull()
  })
  it('marks are not hit-tested as elements', () => {
    expect(hitTest(scene.index, 600, 600)).toBeNull()
  })
  it('an empty index hits nothing', () => {
    expect(hitTest(buildElementIndex([]), 0, 0)).toBeNull()
  })
})

describe('hitTest on the 512-nozzle chip', () => {
  const doc = generateParallelChip({ nozzles: 512 })
  const scene = sceneFor(doc)
  it('picks the right nozzle among 512 quickly', () => {
    const n = doc.components.find(c => c.id === 'b2-n77')!
    const t0 = performance.now()
    let id: string | null = null
    for (let i = 0; i < 1000; i++) id = hitTest(scene.index, n.position.x + 100, n.position.y)
    expect(id).toBe('b2-n77')
    expect((performance.now() - t0) / 1000).toBeLessThan(1) // ms per query; measured ≈ 0.01 ms
  })
})
