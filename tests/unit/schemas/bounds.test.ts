// Upper bounds of the chip document (shared/schemas/chip/limits.ts): each refusal says the limit; the largest
// accepted document parses, one piece more does not; the full and the incremental parse agree at the limits.
import { describe, expect, it } from 'vitest'
import {
  CHIP_LIMITS,
  documentPieceCount,
  parseChipDocument,
  parseEditedDocument,
  rememberParsed,
  type ChipDocument,
} from '#shared/schemas/chip'
import { loadDocumentFixture } from './load-fixture'
import { largestAcceptedDocument } from './largest'

const base = () => loadDocumentFixture('t-junction-basic.json')
const messages = (doc: unknown) => {
  const r = parseChipDocument(doc)
  return r.ok ? [] : r.errors.map(e => e.message)
}

describe('chip document limits', () => {
  it('a 1e29 µm punch (the 2.4 KB document that took the server down) is refused with the limit', () => {
    const doc = base()
    doc.ports[0].punchDiameter = 1e29
    expect(messages(doc)).toContain(
      `Port punch diameter must be at most 10 000 µm (got 1e+29) on port "${doc.ports[0].id}"`,
    )
    doc.ports[0].punchDiameter = 1e11
    expect(messages(doc)[0]).toMatch(/at most 10 000 µm \(got 100000000000\)/)
  })
  it('coordinates, lengths, depths and rotations say their limits', () => {
    const doc = base()
    doc.channels[0].points[0].x = 250_000
    doc.channels[0].width = 1e9
    doc.layers[0].depth = 6000
    doc.components[0].rotation = 720
    const m = messages(doc).join('\n')
    expect(m).toContain('x must be at most 200 000 µm (got 250000)')
    expect(m).toContain('Channel width must be at most 400 000 µm (got 1000000000)')
    expect(m).toContain('Layer depth must be at most 5000 µm (got 6000)')
    expect(m).toContain('Component rotation must be between −360° and 360° (got 720)')
  })
  it('counts: nozzles per array, points per channel, elements of a kind', () => {
    const doc = base()
    const layer = doc.layers[0].id
    doc.components.push({
      kind: 'step-array',
      id: 'arr',
      layerId: layer,
      supplyLayerId: layer,
      reservoirLayerId: 'x',
      position: { x: 0, y: 0 },
      nozzleCount: 100_000,
      pitch: 10,
      nozzleWidth: 5,
      nozzleLength: 20,
      supplyWidth: 50,
      reservoirWidth: 50,
      margin: 10,
    })
    doc.channels[0].points = Array.from({ length: 2001 }, (_, i) => ({ x: i, y: i % 2 }))
    const m = messages(doc).join('\n')
    expect(m).toContain('Step array nozzle count must be at most 10 000 (got 100000)')
    expect(m).toContain('Channel must have at most 2000 points: split it into several channels')
    const many = base()
    many.layers = Array.from({ length: 33 }, (_, i) => ({ id: `l${i}`, name: `L${i}`, depth: 10 + i }))
    expect(messages(many)).toContain('A chip can have at most 32 layers (got 33): split it into several designs')
  })
  it('operating-point values are bounded in the units they are given in', () => {
    const doc = base()
    const op = doc.operatingPoints[0]
    op.inlets[0] = { ...op.inlets[0], mode: 'pressure', value: 2000, unit: 'psi' } // 137 895 mbar
    op.continuousLiquid = { viscosityMPaS: 1e300, densityKgPerM3: 1e-300 }
    const m = messages(doc).join('\n')
    expect(m).toContain('Inlet pressure must be at most 100 000 mbar (10 MPa)')
    expect(m).toContain('Viscosity must be at most 10 000 000 mPa·s')
    expect(m).toContain('Density must be at least 0.01 kg/m³')
  })
  it('the largest accepted document parses with exactly the piece limit; one nozzle more is refused', () => {
    const doc = largestAcceptedDocument() as Record<string, any>
    const r = parseChipDocument(doc)
    expect(r.ok).toBe(true)
    if (!r.ok) return
    expect(documentPieceCount(r.document)).toBe(CHIP_LIMITS.pieces)
    const last = doc.components[doc.components.length - 1]
    last.nozzleCount += 1
    expect(messages(doc)).toEqual([
      'A chip can be drawn with at most 40 000 pieces (channel segments, nozzles, serpentine turns, ports, marks; got 40 001): split it into several designs',
    ])
  })
  it('the incremental parse refuses what the full parse refuses at the limits', () => {
    const r = parseChipDocument(largestAcceptedDocument())
    if (!r.ok) throw new Error('largest document refused')
    rememberParsed(r.document)
    const edited: ChipDocument = {
      ...r.document,
      ports: [...r.document.ports, { ...r.document.ports[0]!, id: 'one-more' }],
    }
    const inc = parseEditedDocument(edited)
    expect(inc.ok).toBe(false)
    expect(inc).toEqual(parseChipDocument(edited))
  })
})
