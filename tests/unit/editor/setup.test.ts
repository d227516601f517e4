// Layers, operating points and channel bends as named actions: each checked by the shared schema, each one undo step.
import { describe, expect, it } from 'vitest'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import { actions, runAction, type ActionArgs, type ActionName } from '../../../shared/editor'
import { forecastDocument } from '../../../shared/physics/document'
import { fixtureDocument } from '../../support/factory'

const doc = (): ChipDocument => {
  const r = parseChipDocument(fixtureDocument())
  if (!r.ok) throw new Error('fixture')
  return r.document
}
function run<N extends ActionName>(d: ChipDocument, name: N, args: ActionArgs<N>): ChipDocument {
  const r = runAction(d, actions[name] as (d: ChipDocument, a: ActionArgs<N>) => ReturnType<typeof actions.move>, args)
  if (!r.ok) throw new Error(r.refusal.message)
  expect(r.history).toBe('record')
  return r.doc
}
function refusal<N extends ActionName>(d: ChipDocument, name: N, args: ActionArgs<N>): string {
  const r = runAction(d, actions[name] as (d: ChipDocument, a: ActionArgs<N>) => ReturnType<typeof actions.move>, args)
  if (r.ok) throw new Error('expected a refusal')
  return r.refusal.message
}

describe('layers', () => {
  it('adds a layer at a depth with a fresh id, renames it and changes its depth', () => {
    const created: string[] = []
    let d = run(doc(), 'addLayer', { depth: 120, created })
    expect(created).toEqual(['layer-1'])
    expect(d.layers.at(-1)).toEqual({ id: 'layer-1', name: '120 µm deep', depth: 120 })
    d = run(d, 'setLayerField', { id: 'layer-1', path: 'name', value: 'Reservoirs' })
    d = run(d, 'setLayerField', { id: 'layer-1', path: 'depth', value: 150 })
    expect(d.layers.at(-1)).toEqual({ id: 'layer-1', name: 'Reservoirs', depth: 150 })
  })

  it('a zero depth is refused with the schema message', () => {
    expect(refusal(doc(), 'setLayerField', { id: 'ch50', path: 'depth', value: 0 })).toMatch(
      /Layer depth must be > 0 µm/,
    )
  })

  it('a layer in use is not removed, and the refusal names what is on it; an empty one goes and marks let go of it', () => {
    expect(refusal(doc(), 'removeLayer', { id: 'ch50' })).toMatch(
      /Layer "Channels" still holds .*tj-1.*move or delete them first/,
    )
    const created: string[] = []
    let d = run(doc(), 'addLayer', { depth: 20, created })
    d = run(d, 'setField', { id: 'align-1', path: 'layerIds', value: ['ch50', created[0]] })
    d = run(d, 'removeLayer', { id: created[0]! })
    expect(d.layers.map(l => l.id)).toEqual(['ch50'])
    expect(d.marks.find(m => m.id === 'align-1')!.layerIds).toEqual(['ch50'])
  })

  it('moving a channel to a deeper layer changes its hydraulic resistance: the inlet pressures drop (Bruus 2008, R ∝ 1/h³ for w ≫ h)', () => {
    const created: string[] = []
    let d = run(doc(), 'addLayer', { depth: 100, created })
    const before = forecastDocument(d).network.inlets.find(i => i.port === 'oil-in')!.pressure.value
    d = run(d, 'setField', { id: 'oil-feed', path: 'layerId', value: created[0] })
    const after = forecastDocument(d).network.inlets.find(i => i.port === 'oil-in')!.pressure.value
    expect(after).toBeLessThan(before)
  })
})

describe('operating points', () => {
  it('a new point copies the active one under a fresh id and becomes active; an edit to it leaves the first alone', () => {
    const created: string[] = []
    let d = run(doc(), 'addOperatingPoint', { name: 'Faster oil', created })
    expect(created).toEqual(['op-2'])
    expect(d.activeOperatingPoint).toBe('op-2')
    expect(d.operatingPoints[1]).toMatchObject({ id: 'op-2', name: 'Faster oil', inlets: d.operatingPoints[0]!.inlets })
    const oil = d.operatingPoints[1]!.inlets.find(i => i.portId === 'oil-in')!
    d = run(d, 'setInlet', { opId: 'op-2', setting: { ...oil, value: oil.value * 3 } })
    expect(d.operatingPoints[0]!.inlets.find(i => i.portId === 'oil-in')!.value).toBe(oil.value)
  })

  it('the forecast follows the active point: more oil, smaller drops (Garstecki et al. 2006, L/w = 1 + α·Qd/Qc)', () => {
    let d = run(doc(), 'addOperatingPoint', {})
    const first = forecastDocument(d).junctions[0]!.forecast!.dropletDiameter.value
    const oil = d.operatingPoints[1]!.inlets.find(i => i.portId === 'oil-in')!
    d = run(d, 'setInlet', { opId: d.operatingPoints[1]!.id, setting: { ...oil, value: oil.value * 3 } })
    const faster = forecastDocument(d).junctions[0]!.forecast!.dropletDiameter.value
    expect(faster).toBeLessThan(first)
    d = run(d, 'setDocumentField', { path: 'activeOperatingPoint', value: 'op-1' })
    expect(forecastDocument(d).junctions[0]!.forecast!.dropletDiameter.value).toBe(first)
  })

  it('removing the active point makes the first left active; the last one cannot go', () => {
    let d = run(doc(), 'addOperatingPoint', {})
    d = run(d, 'removeOperatingPoint', { id: 'op-2' })
    expect(d.activeOperatingPoint).toBe('op-1')
    expect(refusal(d, 'removeOperatingPoint', { id: 'op-1' })).toMatch(
      /only operating point: add another before removing it/,
    )
  })
})

describe('channel bends', () => {
  it('inserts a bend into the segment nearest the click', () => {
    const inserted: number[] = []
    const d = run(doc(), 'insertChannelPoint', { id: 'water-feed', point: { x: 5000, y: 4000 }, inserted })
    expect(inserted).toEqual([2])
    expect(d.channels.find(c => c.id === 'water-feed')!.points).toEqual([
      { x: 6500, y: 5500 },
      { x: 5000, y: 5500 },
      { x: 5000, y: 4000 },
      { x: 5000, y: 3200 },
    ])
  })

  it('dragging a bend moves only it; dragging an end lets go of its terminal, dropping it on one attaches it', () => {
    let d = run(doc(), 'moveChannelPoint', { id: 'water-feed', index: 1, point: { x: 5500, y: 5000 } })
    const ch = () => d.channels.find(c => c.id === 'water-feed')!
    expect(ch().points[1]).toEqual({ x: 5500, y: 5000 })
    expect(ch().start).toEqual({ element: 'water-in', terminal: 'port' })
    d = run(d, 'moveChannelPoint', { id: 'water-feed', index: 0, point: { x: 7000, y: 6000 } })
    expect(ch().start).toBeUndefined()
    d = run(d, 'moveChannelPoint', {
      id: 'water-feed',
      index: 0,
      point: { x: 6500, y: 5500 },
      attach: { element: 'water-in', terminal: 'port' },
    })
    expect(ch().start).toEqual({ element: 'water-in', terminal: 'port' })
  })

  it('removes a bend; a two-point channel keeps its points and says to delete the channel instead', () => {
    const d = run(doc(), 'removeChannelPoint', { id: 'water-feed', index: 1 })
    expect(d.channels.find(c => c.id === 'water-feed')!.points).toHaveLength(2)
    expect(refusal(d, 'removeChannelPoint', { id: 'water-feed', index: 0 })).toMatch(
      /needs at least two points: delete the channel instead/,
    )
  })
})
