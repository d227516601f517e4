import { describe, expect, it } from 'vitest'
import { parseChipDocument, componentTerminals, type ChipDocument } from '../../../shared/schemas/chip'
import {
  actionLabel,
  actions,
  runAction,
  startHistory,
  commit,
  undo,
  redo,
  canUndo,
  undoLabel,
  redoLabel,
  type ActionArgs,
  type ActionName,
  snapToGrid,
  snapDelta,
  snapPoint,
  copy,
  importDocument,
  exportDocument,
} from '../../../shared/editor'
import { fixtureDocument } from '../../support/factory'

const doc = (): ChipDocument => {
  const r = parseChipDocument(fixtureDocument())
  if (!r.ok) throw new Error('fixture')
  return r.document
}

describe('editor actions', () => {
  it('move carries the attached channel ends with the junction', () => {
    const r = runAction(doc(), actions.move, { ids: ['tj-1'], dx: 100, dy: -50 })
    expect(r.ok).toBe(true)
    if (!r.ok) return
    const tj = r.doc.components.find(c => c.id === 'tj-1')!
    expect(tj.position).toEqual({ x: 5100, y: 2950 })
    const t = Object.fromEntries(componentTerminals(tj).map(x => [x.name, x.position]))
    expect(r.doc.channels.find(c => c.id === 'oil-feed')!.points.at(-1)).toEqual(t.continuous)
    expect(r.doc.channels.find(c => c.id === 'drops-out')!.points[0]).toEqual(t.outlet)
    expect(r.history).toBe('record')
  })

  it('rotate turns a junction 90° about its centre and its arms follow', () => {
    const r = runAction(doc(), actions.rotate, { ids: ['tj-1'], deg: 90 })
    if (!r.ok) throw new Error(r.refusal.message)
    const tj = r.doc.components.find(c => c.id === 'tj-1')!
    expect(tj.rotation).toBe(90)
    expect(tj.position).toEqual({ x: 5000, y: 3000 })
    const outlet = componentTerminals(tj).find(t => t.name === 'outlet')!.position
    expect(outlet.x).toBeCloseTo(5000, 6)
    expect(outlet.y).toBeCloseTo(3200, 6)
  })

  it('duplicate makes fresh ids and lets go of attachments outside the copy', () => {
    const inserted: string[] = []
    const r = runAction(doc(), actions.duplicate, { ids: ['tj-1', 'drops-out'], offset: { x: 0, y: -1000 }, inserted })
    if (!r.ok) throw new Error(r.refusal.message)
    expect(inserted).toEqual(['tj-2', 'drops-out-1'])
    const ch = r.doc.channels.find(c => c.id === 'drops-out-1')!
    expect(ch.start).toEqual({ element: 'tj-2', terminal: 'outlet' })
    expect(ch.end).toBeUndefined()
  })

  it('delete loosens channel ends and drops the inlet settings of removed ports', () => {
    const r = runAction(doc(), actions.delete, { ids: ['tj-1', 'oil-in'] })
    if (!r.ok) throw new Error(r.refusal.message)
    expect(r.doc.channels.find(c => c.id === 'oil-feed')!.start).toBeUndefined()
    expect(r.doc.channels.find(c => c.id === 'oil-feed')!.end).toBeUndefined()
    expect(r.doc.operatingPoints[0]!.inlets.map(i => i.portId)).toEqual(['water-in'])
  })

  it('an invalid edit is refused with the schema message and the document is untouched', () => {
    const before = doc()
    const snapshot = JSON.stringify(before)
    const r = runAction(before, actions.setField, { id: 'tj-1', path: 'mainWidth', value: -3 })
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.refusal.message).toMatch(/T-junction main width must be > 0 µm/)
    expect(JSON.stringify(before)).toBe(snapshot)
  })

  it('set field, inlet, channel point, place component and port all validate', () => {
    let d = doc()
    const step = <A>(a: (doc: ChipDocument, args: A) => any, args: A) => {
      const r = runAction(d, a, args)
      if (!r.ok) throw new Error(r.refusal.message)
      d = r.doc
    }
    step(actions.setField, { id: 'tj-1', path: 'inletWidth', value: 60 })
    step(actions.setInlet, { opId: 'op-1', setting: { portId: 'water-in', mode: 'flow', value: 3, unit: 'uL/min' } })
    step(actions.insertChannelPoint, { id: 'oil-feed', index: 1, point: { x: 3000, y: 3000 } })
    const created: string[] = []
    step(actions.placeComponent, { kind: 'step-nozzle', position: { x: 2000, y: 1000 }, layerId: 'ch50', created })
    step(actions.placePort, {
      kind: 'inlet',
      phase: 'dispersed',
      position: { x: 500, y: 5000 },
      layerId: 'ch50',
      created,
    })
    step(actions.addChannel, {
      points: [
        { x: 0, y: 0 },
        { x: 100, y: 0 },
      ],
      width: 50,
      layerId: 'ch50',
    })
    expect(created).toEqual(['step-1', 'dispersed-in-1'])
    expect(d.layers.length).toBe(2)
    expect(d.operatingPoints[0]!.inlets.find(i => i.portId === 'water-in')!.value).toBe(3)
    expect(d.channels.find(c => c.id === 'oil-feed')!.points.length).toBe(3)
    expect(d.channels.at(-1)!.id).toBe('channel-1')
  })
})

describe('history', () => {
  it('a drag is one undo step: previews skip, the release records one step', () => {
    const start = doc()
    let h = startHistory(start)
    for (let i = 1; i <= 10; i++) {
      const r = runAction(start, actions.move, { ids: ['tj-1'], dx: 10 * i, dy: 0, preview: true })
      if (!r.ok) throw new Error(r.refusal.message)
      h = commit(h, r.doc, r.history)
    }
    const done = runAction(start, actions.move, { ids: ['tj-1'], dx: 100, dy: 0 })
    if (!done.ok) throw new Error(done.refusal.message)
    h = commit(h, done.doc, done.history)
    expect(h.past.length).toBe(1)
    h = undo(h)
    expect(h.present).toBe(start)
    expect(canUndo(h)).toBe(false)
    h = redo(h)
    expect(h.present.components[0]!.position.x).toBe(5100)
  })

  it('a new edit after undo clears redo', () => {
    let h = startHistory(doc())
    const a = runAction(h.present, actions.setField, { id: 'tj-1', path: 'mainWidth', value: 90 })
    if (!a.ok) throw new Error()
    h = undo(commit(h, a.doc, a.history))
    const b = runAction(h.present, actions.setField, { id: 'tj-1', path: 'mainWidth', value: 80 })
    if (!b.ok) throw new Error()
    h = commit(h, b.doc, b.history)
    expect(h.future.length).toBe(0)
    expect(h.past.length).toBe(1)
  })

  it('each step keeps its action in words, for the undo and redo buttons', () => {
    let h = startHistory(doc())
    const steps: Array<[ActionName, ActionArgs<ActionName>]> = [
      ['move', { ids: ['tj-1'], dx: 50, dy: 0 }],
      ['setField', { id: 'tj-1', path: 'mainWidth', value: 90 }],
      ['placeComponent', { kind: 'y-junction', position: { x: 500, y: 500 }, layerId: 'ch50' }],
    ]
    for (const [name, args] of steps) {
      const r = runAction(
        h.present,
        actions[name] as (d: ChipDocument, a: unknown) => ReturnType<typeof actions.move>,
        args,
      )
      if (!r.ok) throw new Error(r.refusal.message)
      h = commit(h, r.doc, r.history, actionLabel(name, args))
    }
    expect(undoLabel(h)).toBe('place y-junction')
    h = undo(undo(h))
    expect(undoLabel(h)).toBe('move')
    expect(redoLabel(h)).toBe('set mainWidth')
    h = redo(h)
    expect([undoLabel(h), redoLabel(h)]).toEqual(['set mainWidth', 'place y-junction'])
  })
})

describe('snapping and exchange', () => {
  it('snaps to the grid pitch in µm', () => {
    expect(snapToGrid({ x: 124, y: -76 }, 50)).toEqual({ x: 100, y: -100 })
    expect(snapToGrid({ x: 124, y: -76 }, 0)).toEqual({ x: 124, y: -76 })
    expect(snapDelta({ x: 5000, y: 3000 }, 37, 12, 25)).toEqual({ x: 25, y: 0 })
  })

  it('a click near a terminal snaps onto it', () => {
    const s = snapPoint(doc(), { x: 5190, y: 3010 }, { pitch: 100, terminalRadius: 30 })
    expect(s.terminal?.ref).toEqual({ element: 'tj-1', terminal: 'outlet' })
    expect(s.point).toEqual({ x: 5200, y: 3000 })
  })

  it('copy then paste places a renamed copy at an offset', () => {
    const d = doc()
    const r = runAction(d, actions.paste, { clip: copy(d, ['oil-in']), offset: { x: 0, y: 1000 } })
    if (!r.ok) throw new Error(r.refusal.message)
    expect(r.doc.ports.at(-1)).toMatchObject({ id: 'oil-in-1', position: { x: 1500, y: 4000 } })
  })

  it('export and import round-trip; a bad file is refused with a message', () => {
    const d = doc()
    const back = importDocument(exportDocument(d))
    expect(back.ok && back.doc).toEqual(d)
    expect(importDocument('{ nope')).toMatchObject({ ok: false })
    const bad = importDocument(JSON.stringify({ ...d, layers: [] }))
    expect(bad.ok).toBe(false)
    if (!bad.ok) expect(bad.message).toMatch(/at least one layer/)
  })
})

describe('sweeps for the plots', async () => {
  const { forecastDocument } = await import('../../../shared/physics/document')
  const { sweepFlowRatio, sweepCapillary, regimeMap } = await import('../../../shared/editor/sweep')
  const f = forecastDocument(doc()).junctions.find(j => j.element === 'tj-1')!.forecast!

  it('droplet size grows with the flow-rate ratio (squeezing: L/w = 1 + α·φ, Garstecki et al. 2006)', () => {
    const s = sweepFlowRatio(f, 12)
    expect(s.length).toBe(12)
    expect(s.at(-1)!.diameterUm).toBeGreaterThan(s[0]!.diameterUm)
    expect(s[0]!.x).toBeLessThan(s.at(-1)!.x)
  })

  it('the capillary sweep holds the ratio and spans two decades of Ca; the map covers its grid', () => {
    const s = sweepCapillary(f, 10)
    expect(s.at(-1)!.x / s[0]!.x).toBeCloseTo(400, 0)
    expect(regimeMap(f, 6).length).toBe(36)
  })
})
