// The editor's incremental check gives the full parse's answer: same document, same messages, over many edits.
import { describe, expect, it } from 'vitest'
import { parseChipDocument, parseEditedDocument, rememberParsed, type ChipDocument } from '../../../shared/schemas/chip'
import { actions } from '../../../shared/editor'
import { generateParallelChip } from '../../../geometry/arrays'
import { fixtureDocument } from '../../support/factory'

const doc = (): ChipDocument => {
  const r = parseChipDocument(fixtureDocument())
  if (!r.ok) throw new Error('fixture')
  return r.document
}
const messages = (r: ReturnType<typeof parseChipDocument>) =>
  r.ok ? [] : r.errors.map(e => `${e.path}: ${e.message}`).sort()

/** Edits, valid and not, as the editor makes them (new objects for what changes, the rest shared). */
const EDITS: Array<[string, (d: ChipDocument) => ChipDocument]> = [
  ['move a junction', d => actions.move(d, { ids: ['tj-1'], dx: 120, dy: -40 }).doc],
  ['rotate', d => actions.rotate(d, { ids: ['tj-1'], deg: 90 }).doc],
  ['duplicate', d => actions.duplicate(d, { ids: ['tj-1', 'oil-feed'], offset: { x: 500, y: 500 } }).doc],
  ['delete a port', d => actions.delete(d, { ids: ['out'] }).doc],
  ['negative width', d => actions.setField(d, { id: 'tj-1', path: 'mainWidth', value: -3 }).doc],
  ['arm shorter than the channel', d => actions.setField(d, { id: 'tj-1', path: 'mainWidth', value: 400 }).doc],
  ['unknown layer', d => actions.setField(d, { id: 'oil-feed', path: 'layerId', value: 'nowhere' }).doc],
  [
    'one-point channel',
    d => ({ ...d, channels: d.channels.map(c => (c.id === 'oil-feed' ? { ...c, points: [c.points[0]!] } : c)) }),
  ],
  ['empty name', d => ({ ...d, name: '' })],
  ['no layers', d => ({ ...d, layers: [] })],
  ['duplicate ids', d => ({ ...d, ports: [...d.ports, { ...d.ports[0]! }] })],
  ['unknown active point', d => ({ ...d, activeOperatingPoint: 'op-9' })],
  [
    'inlet setting for a missing port',
    d =>
      actions.setInlet(d, { opId: 'op-1', setting: { portId: 'ghost', mode: 'flow', value: 1, unit: 'uL/min' } }).doc,
  ],
  ['clear the outline', d => actions.clearOutline(d).doc],
  ['add a layer and a point', d => actions.addOperatingPoint(actions.addLayer(d, { depth: 80 }).doc, {}).doc],
  ['a bend', d => actions.insertChannelPoint(d, { id: 'water-feed', point: { x: 5000, y: 4000 } }).doc],
  [
    'a channel end on a missing terminal',
    d => ({
      ...d,
      channels: d.channels.map(c => (c.id === 'oil-feed' ? { ...c, end: { element: 'tj-1', terminal: 'nope' } } : c)),
    }),
  ],
]

describe('incremental document check', () => {
  for (const [name, edit] of EDITS) {
    it(`${name}: same answer as the full parse`, () => {
      const base = doc()
      rememberParsed(base)
      const edited = edit(base)
      const full = parseChipDocument(structuredClone(edited))
      const quick = parseEditedDocument(edited)
      expect(quick.ok).toBe(full.ok)
      expect(messages(quick)).toEqual(messages(full))
      if (quick.ok && full.ok) {
        expect(quick.document).toEqual(full.document)
        expect(Object.keys(quick.document)).toEqual(Object.keys(full.document))
      }
    })
  }

  it('does not trust an element it has not seen parsed: a bad one from outside is caught', () => {
    const base = doc()
    const bad = {
      ...base,
      components: base.components.map(c => ({ ...c, rotation: 'left' })),
    } as unknown as ChipDocument
    expect(parseEditedDocument(bad).ok).toBe(false)
  })

  it('on a 512-nozzle chip, checking a one-part move costs a fraction of the full parse', () => {
    const big = parseChipDocument(generateParallelChip({ nozzles: 512, name: 'big' }))
    if (!big.ok) throw new Error('big chip')
    rememberParsed(big.document)
    const moved = actions.move(big.document, { ids: [big.document.components[3]!.id], dx: 50, dy: 0 }).doc
    const time = (f: () => unknown) => {
      f()
      const t = performance.now()
      for (let i = 0; i < 5; i++) f()
      return (performance.now() - t) / 5
    }
    const full = time(() => parseChipDocument(moved))
    const quick = time(() => parseEditedDocument(moved))
    expect(parseEditedDocument(moved)).toEqual(parseChipDocument(moved))
    // Not a timing target (those live in `npm run bench`): only that the shortcut is taken at all.
    expect(quick).toBeLessThan(full)
  })
})
