// Tessellation is bounded by design: the segment count comes from the chord tolerance and is capped, so a
// stored document with an absurd radius costs a bounded amount of work (it once looped without end).
import { describe, expect, it } from 'vitest'
import {
  MAX_CIRCLE_SEGMENTS,
  MIN_CIRCLE_SEGMENTS,
  buildOutlines,
  circlePolygon,
  circleSegments,
} from '~~/geometry/outlines'
import { exportDxf } from '~~/geometry/dxf'
import type { ChipDocument } from '#shared/schemas/chip'
import { loadDocumentFixture } from '../schemas/load-fixture'

describe('circle tessellation', () => {
  it('absurd radii give the capped count, never Infinity (1e29 µm punch: was Infinity; 1e11 µm: was 2.2 million)', () => {
    for (const r of [5e28, 5e10, 1e300, Number.MAX_VALUE]) expect(circleSegments(r, 0.1)).toBe(MAX_CIRCLE_SEGMENTS)
    expect(circlePolygon([0, 0], 5e28, 0.1)[0]).toHaveLength(MAX_CIRCLE_SEGMENTS)
  })
  it('tiny and invalid radii or tolerances give the minimum', () => {
    for (const [r, tol] of [
      [0.01, 0.1],
      [0, 0.1],
      [-5, 0.1],
      [Number.NaN, 0.1],
      [Infinity, 0.1],
      [100, 0],
      [100, Number.NaN],
    ] as const) {
      expect(circleSegments(r, tol)).toBe(MIN_CIRCLE_SEGMENTS)
    }
  })
  it('within the cap the chord error (sagitta r(1 − cos π/n)) stays ≤ tolerance, up to the largest punch (10 mm)', () => {
    // Source: sagitta of a chord, elementary geometry.
    for (const r of [1, 37.5, 500, 2500, 5000]) {
      const n = circleSegments(r, 0.1)
      expect(n).toBeLessThan(MAX_CIRCLE_SEGMENTS)
      expect(r * (1 - Math.cos(Math.PI / n))).toBeLessThanOrEqual(0.1)
    }
  })
  it('a stored document with a 1e29 µm punch outlines and exports in bounded time', () => {
    const doc = loadDocumentFixture('t-junction-basic.json') as ChipDocument
    doc.ports[0]!.punchDiameter = 1e29
    const t = performance.now()
    const o = buildOutlines(doc)
    const dxf = exportDxf(doc, { outlines: o, date: '2026-01-01' })
    expect(performance.now() - t).toBeLessThan(5000) // generous: it never finished before
    expect(o.elements.find(e => e.elementId === doc.ports[0]!.id)!.pieces[0]![0]).toHaveLength(MAX_CIRCLE_SEGMENTS)
    expect(dxf).toContain('$INSUNITS')
  })
})
