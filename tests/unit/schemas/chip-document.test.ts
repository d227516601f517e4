import { describe, expect, it } from 'vitest'
import {
  CHIP_DOCUMENT_VERSION,
  parseChipDocument,
  requireChipDocument,
  ChipDocumentInvalid,
} from '#shared/schemas/chip'
import { loadDocumentFixture } from './load-fixture'

// Source for every expectation here: the chip document contract in shared/schemas/chip/README.md.
const messages = (input: unknown): string[] => {
  const r = parseChipDocument(input)
  return r.ok ? [] : r.errors.map(e => e.message)
}

describe('chip document: valid fixture', () => {
  it('parses the T-junction fixture and applies defaults', () => {
    const r = parseChipDocument(loadDocumentFixture('t-junction-basic.json'))
    expect(r.ok).toBe(true)
    if (!r.ok) return
    expect(r.document.version).toBe(CHIP_DOCUMENT_VERSION)
    expect(r.document.components[0]?.kind).toBe('t-junction')
    expect(r.document.channels).toHaveLength(3)
    expect(r.upgradedFrom).toBe(1)
  })
})

describe('chip document: errors name the element and the fix', () => {
  it('negative channel width', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.channels[0].id = 'feed-2'
    doc.channels[0].width = -3
    expect(messages(doc)).toContain('Channel width must be > 0 µm (got -3) on channel "feed-2"')
  })
  it('zero-width channel', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.channels[1].width = 0
    expect(messages(doc)).toContain('Channel width must be > 0 µm (got 0) on channel "water-feed"')
  })
  it('NaN coordinate', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.channels[2].points[1].x = Number.NaN
    const m = messages(doc)
    expect(m).toHaveLength(1)
    expect(m[0]).toMatch(/^x must be a finite number in µm \(got NaN\) on channel "drops-out" at points\.1\.x$/)
  })
  it('a channel with one point', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.channels[0].points = [{ x: 0, y: 0 }]
    expect(messages(doc)[0]).toMatch(/Channel needs at least 2 points .*on channel "oil-feed"/)
  })
  it('unknown layer', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.channels[0].layerId = 'ch99'
    expect(messages(doc)).toEqual(['Unknown layer "ch99" on channel "oil-feed": use one of "ch50"'])
  })
  it('duplicate ids', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.channels[1].id = 'oil-feed'
    doc.channels[1].start = undefined
    expect(messages(doc)[0]).toMatch(/^Duplicate id "oil-feed" on channel "oil-feed"/)
  })
  it('unknown terminal name and unknown element', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.channels[0].end.terminal = 'side'
    doc.channels[2].end.element = 'nowhere'
    expect(messages(doc)).toEqual([
      'Channel "oil-feed" refers to terminal "side" on "tj-1", which has none by that name: use one of "continuous", "dispersed", "outlet"',
      'Channel "drops-out" refers to unknown element "nowhere": use the id of a port or component',
    ])
  })
  it('operating point referring to an unknown or outlet port', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.operatingPoints[0].inlets[0].portId = 'ghost'
    doc.operatingPoints[0].inlets[1].portId = 'out'
    expect(messages(doc)).toEqual([
      'Operating point "op-1" sets unknown port "ghost": use the id of an inlet port',
      'Operating point "op-1" drives outlet port "out": only inlets can be driven',
    ])
  })
  it('component parameter check names the component kind and id', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.components[0].armLength = 60
    expect(messages(doc)[0]).toBe(
      'T-junction arm length must be ≥ the widest channel (100 µm) so each arm leaves the junction (got 60) on t-junction "tj-1"',
    )
  })
  it('unknown active operating point', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.activeOperatingPoint = 'op-9'
    expect(messages(doc)).toEqual(['Active operating point "op-9" does not exist: use one of "op-1"'])
  })
  it('never throws on garbage; requireChipDocument throws a typed error', () => {
    for (const junk of [null, 3, 'doc', [], { version: 'x' }, { version: 99 }]) {
      const r = parseChipDocument(junk)
      expect(r.ok).toBe(false)
      if (!r.ok) expect(r.errors.length).toBeGreaterThan(0)
    }
    expect(() => requireChipDocument({ version: 99 })).toThrow(ChipDocumentInvalid)
    expect(messages({ version: 99 })[0]).toMatch(/newer than this Dropwright understands/)
  })
})
