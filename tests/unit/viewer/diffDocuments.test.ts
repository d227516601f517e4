import { describe, expect, it } from 'vitest'
import { requireChipDocument } from '#shared/schemas/chip'
import { diffDocuments, same } from '../../../components/viewer/lib/diffDocuments'
import { loadDocumentFixture } from '../schemas/load-fixture'

const base = () => requireChipDocument(loadDocumentFixture('t-junction-basic.json'))

describe('diffDocuments', () => {
  it('finds nothing between a document and its copy', () => {
    const d = diffDocuments(base(), base())
    expect(d.entries).toEqual([])
    expect([d.added, d.removed, d.changed]).toEqual([[], [], []])
  })

  it('reports added, removed and changed elements with the changed fields', () => {
    const raw = loadDocumentFixture('t-junction-basic.json')
    raw.components[0].mainWidth = 80
    raw.components[0].position.x = 5100
    raw.channels = raw.channels.filter((c: { id: string }) => c.id !== 'drops-out')
    raw.marks.push({ id: 'align-2', kind: 'cross', position: { x: 9400, y: 6400 }, size: 400, lineWidth: 40 })
    raw.operatingPoints[0].inlets[0].value = 12
    raw.layers[0].depth = 40
    const d = diffDocuments(base(), requireChipDocument(raw))

    expect(d.added).toEqual(['align-2'])
    expect(d.removed).toEqual(['drops-out'])
    expect(d.changed).toEqual(['tj-1'])
    const tj = d.entries.find(e => e.id === 'tj-1')!
    expect(tj).toMatchObject({ collection: 'components', status: 'changed', kind: 't-junction' })
    expect(tj.fields).toEqual([
      { path: 'position.x', before: 5000, after: 5100 },
      { path: 'mainWidth', before: 100, after: 80 },
    ])
    expect(d.entries.find(e => e.id === 'ch50')!.fields).toEqual([{ path: 'depth', before: 50, after: 40 }])
    const op = d.entries.find(e => e.collection === 'operatingPoints')!
    expect(op.fields.map(f => f.path)).toEqual(['inlets'])
    expect(d.entries.find(e => e.id === 'align-2')).toMatchObject({ status: 'added', kind: 'cross', fields: [] })
  })

  it('compares the outline and document-level fields', () => {
    const raw = loadDocumentFixture('t-junction-basic.json')
    raw.outline.width = 12000
    raw.name = 'Narrower T'
    const d = diffDocuments(base(), requireChipDocument(raw))
    expect(d.changed).toEqual(['outline'])
    expect(d.entries[0]).toMatchObject({ collection: 'document', fields: [{ path: 'name', after: 'Narrower T' }] })
    delete raw.outline
    expect(diffDocuments(base(), requireChipDocument(raw)).removed).toEqual(['outline'])
  })

  it('reports a mark whose kind changed as changed, naming the kind', () => {
    const raw = loadDocumentFixture('t-junction-basic.json')
    raw.marks = raw.marks.filter((m: { id: string }) => m.id !== 'align-1')
    raw.marks.push({ id: 'align-1', kind: 'text', position: { x: 600, y: 600 }, text: 'A', height: 200 })
    const d = diffDocuments(base(), requireChipDocument(raw))
    expect(d.changed).toEqual(['align-1'])
    expect(d.entries.find(e => e.id === 'align-1')!.fields.map(f => f.path)).toContain('kind')
  })

  it('ignores float noise but not real changes', () => {
    expect(same(0.1 + 0.2, 0.3)).toBe(true)
    expect(same(100, 100.001)).toBe(false)
    expect(same({ a: 1, b: undefined }, { a: 1 })).toBe(true)
    expect(same([1, 2], [1, 2, 3])).toBe(false)
  })

  it('is pure: it does not touch its inputs', () => {
    const a = base()
    const b = base()
    const snapshot = JSON.stringify([a, b])
    diffDocuments(a, b)
    expect(JSON.stringify([a, b])).toBe(snapshot)
  })
})
