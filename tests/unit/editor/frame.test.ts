import { describe, expect, it } from 'vitest'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import { actions, runAction } from '../../../shared/editor'
import { fixtureDocument } from '../../support/factory'

const doc = (): ChipDocument => {
  const r = parseChipDocument(fixtureDocument())
  if (!r.ok) throw new Error('fixture')
  return r.document
}

describe('chip frame', () => {
  it('sets the outline size, keeping its corner; a chip without one gets one around its parts', () => {
    const d = doc()
    const { outline: _o, ...bare } = d
    const first = runAction(bare as ChipDocument, actions.setOutline, { width: 20000 })
    if (!first.ok) throw new Error(first.refusal.message)
    expect(first.doc.outline).toMatchObject({ kind: 'rectangle', width: 20000 })
    const o = first.doc.outline as { corner: { x: number; y: number }; height: number }
    const ys = [...d.components.map(c => c.position.y), ...d.ports.map(p => p.position.y)]
    expect(o.corner.y).toBeLessThan(Math.min(...ys))
    expect(o.corner.y + o.height).toBeGreaterThan(Math.max(...ys))
    const second = runAction(first.doc, actions.setOutline, { height: 9000 })
    if (!second.ok) throw new Error(second.refusal.message)
    expect(second.doc.outline).toMatchObject({ corner: o.corner, width: 20000, height: 9000 })
  })

  it('refuses a zero-width outline with the schema message', () => {
    const r = runAction(doc(), actions.setOutline, { width: 0 })
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.refusal.message).toMatch(/outline width/i)
  })

  it('places an alignment cross on every layer with a fresh id', () => {
    const created: string[] = []
    const d = doc()
    const r = runAction(d, actions.placeMark, { position: { x: 500, y: 500 }, created })
    if (!r.ok) throw new Error(r.refusal.message)
    const m = r.doc.marks.find(x => x.id === created[0])!
    expect(m).toMatchObject({
      kind: 'cross',
      position: { x: 500, y: 500 },
      size: 500,
      lineWidth: 50,
      layerIds: d.layers.map(l => l.id),
    })
  })
})
