// One forecast summary type from the core to the database and back: the editor's live callouts and the revision
// page's stored ones are built by one function from the same fields, so a renamed field cannot drop a label.
import { describe, expect, it } from 'vitest'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import { forecastDocument, summarizeForecast } from '../../../shared/physics/document'
import { forecastSummary } from '../../../server/services/forecastSummary'
import { forecastLabels } from '../../../composables/revisionMarkers'
import { formatFlowUlMin, formatPressureMbar } from '../../../shared/format/quantity'
import fixture from '../../fixtures/documents/t-junction-basic.json'

const doc = (): ChipDocument => {
  const r = parseChipDocument(structuredClone(fixture))
  if (!r.ok) throw new Error('fixture')
  return r.document
}

describe('forecast callouts on the canvas', () => {
  it('the stored summary gives the same callouts as the live one, inlets included', () => {
    const d = doc()
    const live = summarizeForecast(forecastDocument(d))
    const stored = forecastSummary(d)
    expect(stored.forecastError).toBeNull()
    const fromLive = forecastLabels(d, live, 2000)
    expect(forecastLabels(d, stored, 2000)).toEqual(fromLive)
    // Every junction and every inlet of the document has its callout.
    const inlets = d.operatingPoints[0]!.inlets.map(i => i.portId)
    expect(fromLive.map(l => l.elementId).sort()).toEqual([...d.components.map(c => c.id), ...inlets].sort())
    const first = live.inlets[0]!
    expect(fromLive.find(l => l.elementId === first.portId)!.lines).toEqual([
      formatPressureMbar(first.pressureMbar),
      formatFlowUlMin(first.flowUlPerMin),
    ])
  })

  it('an inlet above the bond limit is a fault; one stored before flows were kept shows its pressure only', () => {
    const d = doc()
    const s = summarizeForecast(forecastDocument(d))
    const limit = Math.min(...s.inlets.map(i => i.pressureMbar)) / 2
    expect(forecastLabels(d, s, limit).filter(l => l.tone === 'fault')).toHaveLength(s.inlets.length)
    const old = { junctions: [], inlets: [{ portId: s.inlets[0]!.portId, pressureMbar: 12.5 }] }
    expect(forecastLabels(d, old)).toEqual([
      expect.objectContaining({ elementId: s.inlets[0]!.portId, lines: [formatPressureMbar(12.5)], tone: 'ok' }),
    ])
  })
})
