import { describe, expect, it } from 'vitest'
import { parseChipDocument, componentTerminals, type ChipDocument } from '../../../shared/schemas/chip'
import { actions, commit, runAction, startHistory, undo } from '../../../shared/editor'
import { fixtureDocument } from '../../support/factory'

const doc = (): ChipDocument => {
  const r = parseChipDocument(fixtureDocument())
  if (!r.ok) throw new Error('fixture')
  return r.document
}

describe('array tool', () => {
  it('replace: the chip becomes 16 step nozzles at the asked pitch, keeping the design name, one undo step', () => {
    const before = doc()
    const r = runAction(before, actions.placeArray, { kind: 'step-nozzle', count: 16, pitch: 80, mode: 'replace' })
    if (!r.ok) throw new Error(r.refusal.message)
    const nozzles = r.doc.components.filter(c => c.kind === 'step-nozzle')
    expect(nozzles).toHaveLength(16)
    expect(r.doc.name).toBe(before.name)
    const ys = nozzles.map(c => c.position.y).sort((a, b) => a - b)
    expect(ys[1]! - ys[0]!).toBeCloseTo(80, 6)
    const h = commit(startHistory(before), r.doc, r.history)
    expect(undo(h).present).toBe(before)
  })

  it('add: 4 T-junctions beside the chip, fresh ids, attached channels, inlets on the active operating point', () => {
    const before = doc()
    const created: string[] = []
    const r = runAction(before, actions.placeArray, { kind: 't-junction', count: 4, pitch: 2500, mode: 'add', created })
    if (!r.ok) throw new Error(r.refusal.message)
    expect(created).toHaveLength(4)
    expect(r.doc.components.filter(c => c.kind === 't-junction')).toHaveLength(
      before.components.filter(c => c.kind === 't-junction').length + 4,
    )
    for (const c of before.components) expect(r.doc.components.find(x => x.id === c.id)).toEqual(c)
    const right = Math.max(...before.components.map(c => c.position.x), ...before.ports.map(p => p.position.x))
    for (const id of created) expect(r.doc.components.find(c => c.id === id)!.position.x).toBeGreaterThan(right)
    // channels attached to a new junction end on its terminals
    const tj = r.doc.components.find(c => c.id === created[0])!
    const terms = componentTerminals(tj).map(t => t.position)
    const ends = r.doc.channels.filter(ch => ch.start?.element === tj.id || ch.end?.element === tj.id)
    expect(ends.length).toBeGreaterThan(0)
    for (const ch of ends) {
      const p = ch.start?.element === tj.id ? ch.points[0]! : ch.points.at(-1)!
      expect(terms.some(t => Math.hypot(t.x - p.x, t.y - p.y) < 1e-6)).toBe(true)
    }
    const op = r.doc.operatingPoints.find(o => o.id === r.doc.activeOperatingPoint)!
    expect(op.inlets.length).toBeGreaterThan(
      before.operatingPoints.find(o => o.id === before.activeOperatingPoint)!.inlets.length,
    )
    expect(r.doc.outline?.kind).toBe('rectangle')
  })

  it('refuses a count that is not a whole number with a message that says what to enter', () => {
    const r = runAction(doc(), actions.placeArray, { kind: 'step-nozzle', count: 2.5, pitch: 80, mode: 'add' })
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.refusal.message).toMatch(/whole number from 1 to/)
  })
})
