// The operating point as set at the bench: typed flows, pressures and temperature replace the design's, inlet by
// phase, and the forecast at the result runs at what was typed.
import { describe, expect, it } from 'vitest'
import { benchPoint, hasBenchSettings } from '#shared/physics/calibration/benchPoint'
import { forecastDocument } from '#shared/physics/document'
import { benchConditions } from '#shared/schemas/bench'
import { chipDocument, type ChipDocument } from '#shared/schemas/chip'
import { loadDocumentFixture } from '../schemas/load-fixture'

const fixture = (): ChipDocument => chipDocument.parse(loadDocumentFixture('t-junction-basic.json'))
const phasesOf = (doc: ChipDocument) =>
  new Map(forecastDocument(doc).network.inlets.map(i => [i.port, i.phase] as const))
const M3S_PER_UL_MIN = 1e-9 / 60

describe('benchPoint', () => {
  it('drives each phase by the flow typed at the bench, and the forecast runs at it', () => {
    const doc = fixture()
    const c = benchConditions.parse({
      continuousFlow: { value: 12, unit: 'uL/min' },
      dispersedFlow: { value: 90, unit: 'uL/h' },
    })
    const p = benchPoint(doc, 'op-1', c, phasesOf(doc))!
    expect(p.applied).toEqual(['continuous flow 12 µL/min', 'dispersed flow 90 µL/h'])
    const inlets = forecastDocument(p.document, p.operatingPointId).network.inlets
    expect(inlets.find(i => i.phase === 'continuous')!.flow.value / M3S_PER_UL_MIN).toBeCloseTo(12, 9)
    expect(inlets.find(i => i.phase === 'dispersed')!.flow.value / M3S_PER_UL_MIN).toBeCloseTo(1.5, 9)
    // The drawn document is left as it was.
    expect(doc.operatingPoints[0]!.inlets.find(s => s.portId === 'oil-in')!.value).toBe(10)
  })

  it('drives a phase by pressure when a pressure is typed, and takes the bench temperature', () => {
    const doc = fixture()
    const c = benchConditions.parse({ dispersedPressureMbar: 60, temperatureC: 30 })
    const p = benchPoint(doc, undefined, c, phasesOf(doc))!
    const op = p.document.operatingPoints[0]!
    expect(op.inlets.find(s => s.portId === 'water-in')).toEqual({
      portId: 'water-in',
      mode: 'pressure',
      value: 60,
      unit: 'mbar',
    })
    expect(op.inlets.find(s => s.portId === 'oil-in')!.mode).toBe('flow')
    expect(op.temperatureC).toBe(30)
    const water = forecastDocument(p.document).network.inlets.find(i => i.port === 'water-in')!
    expect(water.pressure.value).toBeCloseTo(6000, 6) // 60 mbar = 6000 Pa
  })

  it('changes nothing without bench settings, and refuses a flow and a pressure for one phase', () => {
    const doc = fixture()
    const none = benchConditions.parse({ continuousLiquid: 'our own hexadecane lot' })
    expect(hasBenchSettings(none)).toBe(false)
    expect(benchPoint(doc, 'op-1', none, phasesOf(doc))!.document).toBe(doc)
    const both = benchConditions.safeParse({ continuousFlow: { value: 5, unit: 'uL/min' }, continuousPressureMbar: 40 })
    expect(both.success).toBe(false)
    expect(both.error!.issues[0]!.message).toBe('Give the continuous phase its flow or its pressure, not both')
  })
})
