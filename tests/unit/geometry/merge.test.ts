import { describe, expect, it } from 'vitest'
import { multiPolygonArea } from '~~/geometry/area'
import { generateParallelChip } from '~~/geometry/arrays'
import { buildOutlines, mergePieces, mergePiecesSingleSweep, pieceClusters } from '~~/geometry/outlines'
import type { Pair, Polygon } from '~~/geometry/types'
import { signedArea } from '~~/geometry/vec'
import { fixture } from './helpers'

// The clustered, tree-shaped union must give what one polygon-clipping sweep over all pieces gives: the same
// area (shoelace, exteriors minus holes), the same parts and the same holes. Tolerance 1e-9 relative: both
// work on the same 0.1 nm grid, only summation order differs.
const square = (x: number, y: number, s: number): Polygon => [
  [
    [x, y],
    [x + s, y],
    [x + s, y + s],
    [x, y + s],
  ],
]
const holes = (mp: Polygon[]) => mp.reduce((k, p) => k + p.length - 1, 0)

function compare(pieces: Polygon[]) {
  const clustered = mergePieces(pieces)
  const single = mergePiecesSingleSweep(pieces)
  expect(clustered.error).toBeUndefined()
  const a = multiPolygonArea(clustered.merged)
  expect(Math.abs(a - multiPolygonArea(single)) / multiPolygonArea(single)).toBeLessThan(1e-6)
  expect(clustered.merged).toHaveLength(single.length)
  expect(holes(clustered.merged)).toBe(holes(single))
  return clustered.merged
}

describe('clustered union', () => {
  it('equals the single union on every layer of the T-junction fixture and a 48-nozzle array', () => {
    for (const doc of [fixture('t-junction-basic.json'), generateParallelChip({ nozzles: 48, nozzlesPerBank: 24 })]) {
      const o = buildOutlines(doc)
      for (const id of [...doc.layers.map(l => l.id), '_marks']) {
        compare(o.elements.filter(e => e.layerId === id).flatMap(e => e.pieces))
      }
    }
  })
  it('keeps holes, and an island inside a hole stays its own part', () => {
    // A 100 µm frame of four bars (one hole) with a 10 µm square floating in the hole, plus a far square.
    const frame = [
      [
        [0, 0],
        [100, 0],
        [100, 10],
        [0, 10],
      ],
      [
        [90, 0],
        [100, 0],
        [100, 100],
        [90, 100],
      ],
      [
        [0, 90],
        [100, 90],
        [100, 100],
        [0, 100],
      ],
      [
        [0, 0],
        [10, 0],
        [10, 100],
        [0, 100],
      ],
    ].map(r => [r as Pair[]])
    const merged = compare([...frame, square(45, 45, 10), square(500, 500, 20)])
    expect(merged).toHaveLength(3)
    expect(holes(merged)).toBe(1)
    expect(multiPolygonArea(merged)).toBeCloseTo(100 * 100 - 80 * 80 + 100 + 400, 6)
    for (const p of merged) {
      expect(signedArea(p[0]!)).toBeGreaterThan(0) // exteriors counter-clockwise
      for (const h of p.slice(1)) expect(signedArea(h)).toBeLessThan(0) // holes clockwise
    }
  })
  it('a lone clockwise piece comes out counter-clockwise and closed, like the sweep', () => {
    const cw: Polygon = [
      [
        [0, 0],
        [0, 10],
        [10, 10],
        [10, 0],
      ],
    ]
    const [p] = compare([cw])
    expect(signedArea(p![0]!)).toBeCloseTo(100, 9)
    expect(p![0]![0]).toEqual(p![0]![p![0]!.length - 1])
  })
  it('groups only pieces whose boxes touch, transitively', () => {
    const chain = [square(0, 0, 10), square(10, 0, 10), square(20, 5, 10)] // edge to edge, then overlapping
    expect(pieceClusters([...chain, square(100, 0, 10)], 0)).toEqual([[0, 1, 2], [3]])
  })
  // One sweep over a 4,096-nozzle single ladder overflowed the call stack in polygon-clipping 0.15; 3,200 in one
  // bank (196 mm) is the longest single ladder within the document's ±200 000 µm coordinate limit.
  it('merges a 3,200-nozzle single ladder, the longest the coordinate limit allows', () => {
    const doc = generateParallelChip({ nozzles: 3200, nozzlesPerBank: 3200 })
    const o = buildOutlines(doc)
    expect(o.problems).toEqual([])
    const deep = o.layers.find(l => l.layerId === 'deep')!
    expect(deep.polygons).toHaveLength(4) // the ladder (manifold, nozzles' reservoirs, feeds) and three punches
    expect(o.layers.find(l => l.layerId === 'nozzle')!.polygons).toHaveLength(3200 + 2) // + 2 alignment crosses
  }, 30_000)
})
