import { describe, expect, it } from 'vitest'
import { multiPolygonArea } from '~~/geometry/area'
import { buildOutlines, circleSegments, strokePolyline, mergePieces } from '~~/geometry/outlines'
import type { Pair } from '~~/geometry/types'
import { channelsDoc, fixture } from './helpers'

const area = (pts: Pair[], w: number) => {
  const s = strokePolyline(pts, w)
  if (!s.ok) throw new Error(s.reason)
  return multiPolygonArea(mergePieces(s.pieces).merged)
}

describe('outlines', () => {
  it('punch circles keep the chord error (sagitta r(1 − cos π/n)) within the tolerance', () => {
    // Source: sagitta of a chord, elementary geometry.
    for (const r of [100, 375, 500, 2000]) {
      for (const tol of [0.1, 1]) {
        const n = circleSegments(r, tol)
        expect(r * (1 - Math.cos(Math.PI / n))).toBeLessThanOrEqual(tol)
        expect(r * (1 - Math.cos(Math.PI / (n - 1)))).toBeGreaterThan(tol) // and no more sides than needed
      }
    }
  })
  it('a 90° mitred bend covers centre-line length × width exactly', () => {
    // Source: with a square (mitred) outer corner the swept area of an L is (L1 + L2)·w (elementary geometry).
    expect(
      area(
        [
          [0, 0],
          [100, 0],
          [100, 100],
        ],
        10,
      ),
    ).toBeCloseTo(2000, 6)
  })
  it('collinear points change nothing; a sharp bend is bevelled, not spiked', () => {
    expect(
      area(
        [
          [0, 0],
          [30, 0],
          [60, 0],
          [100, 0],
        ],
        10,
      ),
    ).toBeCloseTo(1000, 6)
    const sharp = strokePolyline(
      [
        [0, 0],
        [100, 0],
        [0, 10],
      ],
      10,
    )
    expect(sharp.ok).toBe(true)
    if (!sharp.ok) return
    const xs = mergePieces(sharp.pieces)
      .merged.flat(2)
      .map(p => p[0])
    expect(Math.max(...xs)).toBeLessThan(100 + 10) // a miter would reach ~ 100 + 5/sin(2.9°) ≈ 200 µm
  })
  it('rejects a self-crossing polyline and one that doubles back', () => {
    const s = strokePolyline(
      [
        [0, 0],
        [100, 0],
        [100, 100],
        [50, -50],
      ],
      10,
    )
    expect(s.ok === false && s.reason).toBe('self-crossing')
    const d = strokePolyline(
      [
        [0, 0],
        [100, 0],
        [50, 0],
      ],
      10,
    )
    expect(d.ok === false && d.reason).toBe('doubles-back')
  })
  it('merging keeps holes: a closed square loop of channel is one polygon with one hole', () => {
    const pts = (ps: Pair[]) => ps.map(([x, y]) => ({ x, y }))
    const o = buildOutlines(
      channelsDoc([
        {
          id: 'half-a',
          layerId: 'L',
          width: 10,
          points: pts([
            [1000, 1000],
            [2000, 1000],
            [2000, 2000],
          ]),
        },
        {
          id: 'half-b',
          layerId: 'L',
          width: 10,
          points: pts([
            [2000, 2000],
            [1000, 2000],
            [1000, 1000],
          ]),
        },
      ]),
    )
    const polys = o.layers[0]!.polygons
    expect(polys).toHaveLength(1)
    expect(polys[0]).toHaveLength(2)
    expect(o.problems).toEqual([])
  })
  it('self-crossing channel in a document becomes a problem naming it, the rest still merges', () => {
    const o = buildOutlines(
      channelsDoc([
        {
          id: 'ok',
          layerId: 'L',
          width: 50,
          points: [
            { x: 100, y: 100 },
            { x: 900, y: 100 },
          ],
        },
        {
          id: 'knot',
          layerId: 'L',
          width: 50,
          points: [
            { x: 0, y: 500 },
            { x: 500, y: 500 },
            { x: 500, y: 900 },
            { x: 250, y: 300 },
          ],
        },
      ]),
    )
    expect(o.problems.map(p => [p.rule, p.elementId])).toEqual([['self-crossing', 'knot']])
    expect(multiPolygonArea(o.layers[0]!.polygons)).toBeCloseTo(800 * 50, 6)
  })
  it('the T-junction fixture merges into one connected part per layer, marks on their own layer', () => {
    const o = buildOutlines(fixture('t-junction-basic.json'))
    expect(o.layers.map(l => l.polygons.length)).toEqual([1])
    expect(o.marks).toHaveLength(1)
    expect(o.texts.map(t => t.id)).toEqual(['label'])
    expect(new Set(o.elements.map(e => e.elementId)).size).toBe(3 + 3 + 1 + 1) // channels, ports, component, cross
  })
})
