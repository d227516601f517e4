import { describe, expect, it } from 'vitest'
import {
  describePath,
  describePathText,
  elementName,
  fieldUnit,
  nameOfId,
  namedMessage,
  pathSteps,
  peopleError,
  plainMessage,
} from '#shared/format/fieldLabels'
import { parseChipDocument } from '#shared/schemas/chip'
import { fixtureDocument } from '../../support/factory'

describe("schema paths in people's words", () => {
  const doc = fixtureDocument() as unknown as Record<string, unknown>

  it('reads every spelling of a path', () => {
    expect(pathSteps('document.ports[0].position.x')).toEqual(['ports', 0, 'position', 'x'])
    expect(pathSteps('ports.0.position.x')).toEqual(['ports', 0, 'position', 'x'])
    expect(pathSteps(['ports', 0, 'position', 'x'])).toEqual(['ports', 0, 'position', 'x'])
  })

  it("names the element by kind and id and the field by the inspector's label", () => {
    const components = doc.components as Array<{ id: string; kind: string }>
    const i = components.findIndex(c => c.kind === 't-junction')
    expect(describePath(`components.${i}.mainWidth`, doc)).toEqual({
      element: `T-junction “${components[i]!.id}”`,
      field: 'Main channel width',
    })
    const ports = doc.ports as Array<{ id: string; kind: string }>
    expect(describePathText('document.ports[0].position.x', doc)).toBe(
      `${ports[0]!.kind === 'inlet' ? 'Inlet' : 'Outlet'} “${ports[0]!.id}” · x position`,
    )
  })

  it('an inlet setting of an operating point names its port', () => {
    const op = (doc.operatingPoints as Array<{ name: string; inlets: Array<{ portId: string }> }>)[0]!
    expect(describePath('operatingPoints.0.inlets.0.value', doc)).toEqual({
      element: `Operating point “${op.name}”`,
      field: `Inlet “${op.inlets[0]!.portId}”, set value`,
    })
  })

  it('no raw field id is left on a known field, nor a number index on an element', () => {
    for (const p of [
      'components.0.inletWidth',
      'channels.0.width',
      'layers.0.depth',
      'operatingPoints.0.temperatureC',
      'outline.width',
    ]) {
      const t = describePathText(p, doc)
      expect(t).not.toMatch(/[a-z][A-Z]|\.\d|\[\d/)
    }
  })

  it('an element outside the document is still named by its collection and place', () => {
    expect(elementName('channels', undefined, 4)).toBe('Channel 5')
  })

  it("turns zod's own wording into what to do", () => {
    expect(plainMessage('Invalid input: expected string, received undefined')).toBe('Missing: enter a value')
    expect(plainMessage('Invalid input: expected number, received string')).toBe('Enter a number')
    expect(plainMessage('Channel width must be > 0 µm (got -3) on channel "feed-2"')).toBe(
      'Channel width must be > 0 µm (got -3)',
    )
  })

  it('a broken document from the schema reads as element, field and fix (no path, no JSON)', () => {
    const broken = fixtureDocument() as unknown as {
      channels: Array<{ width: number }>
      ports: Array<Record<string, unknown>>
    }
    broken.channels[0]!.width = -3
    delete broken.ports[0]!.kind
    const r = parseChipDocument(broken)
    expect(r.ok).toBe(false)
    if (r.ok) return
    const lines = r.errors.map(e => peopleError(e, broken as never))
    expect(lines.some(l => /^Channel “[^”]+” · Width: .*-3/.test(l))).toBe(true)
    expect(lines.some(l => /^Port “[^”]+” · Kind: /.test(l))).toBe(true)
    for (const l of lines) expect(l).not.toMatch(/channels\.\d|ports\[|\{ "|received undefined/)
  })

  it("an id in a finding becomes the element's own name where it has one", () => {
    // The fixture: operating point op-1 "Cells in 40 um drops", layer ch50 "Channels", channels named by id only.
    expect(namedMessage(doc, 'Operating point "op-1": the continuous liquid is not classified')).toBe(
      'Operating point “Cells in 40 um drops”: the continuous liquid is not classified',
    )
    expect(namedMessage(doc, 'Gap of 20 µm on layer "ch50", below the process minimum')).toBe(
      'Gap of 20 µm on layer “Channels”, below the process minimum',
    )
    expect(namedMessage(doc, 'Channel "water-feed" is 100 µm wide where it joins terminal "dispersed" of "tj-1"')).toBe(
      'Channel "water-feed" is 100 µm wide where it joins terminal "dispersed" of "tj-1"',
    )
    const named = {
      ...doc,
      channels: (doc.channels as Array<Record<string, unknown>>).map(c =>
        c.id === 'water-feed' ? { ...c, name: 'Water feed' } : c,
      ),
    }
    expect(namedMessage(named, 'Channel "water-feed" is 100 µm wide')).toBe('Channel “Water feed” is 100 µm wide')
    expect(nameOfId(named, 'water-feed')).toBe('Channel “Water feed”')
    expect(nameOfId(doc, 'op-1')).toBe('Operating point “Cells in 40 um drops”')
    expect(nameOfId(doc, 'ch50')).toBe('Layer “Channels”')
    expect(nameOfId(doc, 'tj-1')).toBe('T-junction “tj-1”')
  })

  it('every numeric field has its unit', () => {
    expect(['mainWidth', 'position.x', 'outline.width', 'channels.0.width', 'depth'].map(fieldUnit)).toEqual([
      'µm',
      'µm',
      'µm',
      'µm',
      'µm',
    ])
    expect(
      ['rotation', 'temperatureC', 'interfacialTensionMNPerM', 'continuousLiquid.viscosityMPaS', 'nozzleCount'].map(
        fieldUnit,
      ),
    ).toEqual(['°', '°C', 'mN/m', 'mPa·s', ''])
  })
})
