// The forecast panels of the editor: the selected junction's table (unit, method and source on hover, ⚠ outside
// validity) and the plots (ECharts, SVG) with the operating point named in figures.
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import { forecastDocument } from '../../../shared/physics/document'
import EditorJunctionTable from '../../../components/editor/EditorJunctionTable.vue'
import EditorPlots from '../../../components/editor/EditorPlots.vue'
import fixture from '../../fixtures/documents/t-junction-basic.json'
import RevisionForecast from '../../../components/revision/RevisionForecast.vue'
import { summarizeForecast } from '../../../shared/physics/document/summary'
import { formatLengthUm, formatNumber } from '../../../shared/format/quantity'
import { GLOSSARY } from '../../../shared/format/glossary'

const doc = (): ChipDocument => {
  const r = parseChipDocument(structuredClone(fixture))
  if (!r.ok) throw new Error('fixture')
  return r.document
}

describe('EditorJunctionTable', () => {
  it("shows each quantity in the trade's unit with its method and source on hover", () => {
    const forecast = forecastDocument(doc())
    const f = forecast.junctions[0]!.forecast!
    const w = mount(EditorJunctionTable, { props: { forecast, junctionId: 'tj-1' } })
    const row = w.get('[data-test="forecast-dropletDiameter"]')
    const um = f.dropletDiameter.value * 1e6
    expect(row.text()).toContain(
      formatLengthUm(um, f.dropletDiameter.valid && f.frequency.valid && f.regime.valid ? 'estimate' : 'indicative'),
    )
    expect(row.attributes('title')).toContain(f.dropletDiameter.method)
    expect(row.attributes('title')).toContain(f.dropletDiameter.source)
    expect(w.get('[data-test="forecast-laplacePressure"]').text()).toMatch(/mbar$/)
    if (!f.dropletDiameter.valid) expect(row.text()).toContain('⚠')
  })

  it('⚠ outside validity says which limit and where the chip stands (issue 16 item 7)', () => {
    const forecast = forecastDocument(doc())
    const f = forecast.junctions[0]!.forecast!
    expect(f.dropletDiameter.valid && f.frequency.valid).toBe(false) // the fixture's T-junction is outside a method's range
    const w = mount(EditorJunctionTable, { props: { forecast, junctionId: 'tj-1' } })
    const items = w.findAll('[data-test="validity-why"] li').map(li => li.text())
    expect(items).toEqual(f.warnings.map(x => x.message))
    expect(items.some(t => /\d/.test(t) && /[≤≥<>]|below|exceeds|outside|past/.test(t))).toBe(true)
    expect(w.get('[data-test="forecast-dropletDiameter"]').attributes('title')).toContain(f.warnings[0]!.message)
  })

  it("says why a part has no forecast: the forecast's own warning for it", () => {
    const d = doc()
    const loose = {
      ...d,
      components: [...d.components, { ...d.components[0]!, id: 'tj-9', position: { x: 9000, y: 6000 } }],
    }
    const w = mount(EditorJunctionTable, { props: { forecast: forecastDocument(loose), junctionId: 'tj-9' } })
    expect(w.text()).toContain('Component "tj-9" is not connected to any channel')
  })
})

describe('one chip, one text (issue 16: 135 Hz in the editor, 140 Hz on the revision page)', () => {
  it("the editor's junction table and the revision page show the same diameter and rate", () => {
    // Flows that give three-figure numbers (the fixture's round flows give round sizes that hide the difference).
    const d = doc()
    d.operatingPoints[0]!.inlets = d.operatingPoints[0]!.inlets.map(i => ({ ...i, value: i.value * 1.37 }))
    const forecast = forecastDocument(d)
    // A junction inside its methods' validity (the case of the report: three figures in the editor, two on the page).
    const jf = forecast.junctions[0]!.forecast!
    for (const q of [jf.regime, jf.dropletDiameter, jf.frequency]) q.valid = true
    const s = summarizeForecast(forecast)
    const editor = mount(EditorJunctionTable, { props: { forecast, junctionId: 'tj-1' } })
    const summary = {
      ...s,
      findings: { errors: 0, warnings: 1 },
      processId: null,
      forecastError: null,
    }
    const revision = mount(RevisionForecast, { props: { summary: summary as never } })
    const row = revision.get('[data-test="forecast-tj-1"]').findAll('td')
    const cell = (k: string) => editor.get(`[data-test="forecast-${k}"] td:last-child`).text().replace('⚠ ', '')
    expect(row[2]!.text()).toBe(cell('dropletDiameter'))
    expect(row[3]!.text()).toBe(cell('frequency'))
    expect(revision.text()).toContain('1 warning (listed')
  })

  it('φ is the dispersed fraction Qd/(Qc + Qd) and defined on hover; the flow-rate ratio is Qd/Qc', () => {
    const w = mount(EditorJunctionTable, { props: { forecast: forecastDocument(doc()), junctionId: 'tj-1' } })
    expect(w.get('[data-test="forecast-dispersedFraction"] abbr').attributes('title')).toContain('φ = Qd / (Qc + Qd)')
    expect(w.get('[data-test="forecast-flowRateRatio"] abbr').attributes('title')).toContain(
      GLOSSARY.flowRateRatio.definition,
    )
    expect(JSON.stringify(GLOSSARY).match(/φ =/g)).toHaveLength(1)
  })
})

describe('EditorPlots', () => {
  it('draws three plots for the selected junction and names the operating point in figures', async () => {
    const forecast = forecastDocument(doc())
    const f = forecast.junctions[0]!.forecast!
    const w = mount(EditorPlots, { props: { forecast, junctionId: 'tj-1' }, attachTo: document.body })
    await new Promise(r => setTimeout(r, 20))
    expect(w.findAll('figure')).toHaveLength(3)
    expect(w.get('[data-test="plot-current"]').text()).toContain(`Qd/Qc = ${formatNumber(f.flowRateRatio.value, 3)}`)
    expect(w.get('[data-test="plot-ratio"] [role="img"]').attributes('aria-label')).toContain('flow-rate ratio')
    w.unmount()
  })

  it('asks for a junction when none is selected', () => {
    const w = mount(EditorPlots, { props: { forecast: forecastDocument(doc()), junctionId: null } })
    expect(w.text()).toContain('Select a connected junction')
  })
})
