// The forecast panels of the editor: the selected junction's table (unit, method and source on hover, ⚠ outside
// validity) and the plots (ECharts, SVG) with the operating point named in figures.
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import { forecastDocument } from '../../../shared/physics/document'
import EditorJunctionTable from '../../../components/editor/EditorJunctionTable.vue'
import EditorPlots from '../../../components/editor/EditorPlots.vue'
import fixture from '../../fixtures/documents/t-junction-basic.json'

const doc = (): ChipDocument => { const r = parseChipDocument(structuredClone(fixture)); if (!r.ok) throw new Error('fixture'); return r.document }

describe('EditorJunctionTable', () => {
  it('shows each quantity in the trade\'s unit with its method and source on hover', () => {
    const forecast = forecastDocument(doc())
    const f = forecast.junctions[0]!.forecast!
    const w = mount(EditorJunctionTable, { props: { forecast, junctionId: 'tj-1' } })
    const row = w.get('[data-test="forecast-dropletDiameter"]')
    const um = f.dropletDiameter.value * 1e6
    expect(row.text()).toContain(`${Number(um.toPrecision(3))} µm`)
    expect(row.attributes('title')).toContain(f.dropletDiameter.method)
    expect(row.attributes('title')).toContain(f.dropletDiameter.source)
    expect(w.get('[data-test="forecast-laplacePressure"]').text()).toMatch(/mbar$/)
    if (!f.dropletDiameter.valid) expect(row.text()).toContain('⚠')
  })

  it('says why a part has no forecast: the forecast\'s own warning for it', () => {
    const d = doc()
    const loose = { ...d, components: [...d.components, { ...d.components[0]!, id: 'tj-9', position: { x: 9000, y: 6000 } }] }
    const w = mount(EditorJunctionTable, { props: { forecast: forecastDocument(loose), junctionId: 'tj-9' } })
    expect(w.text()).toContain('Component "tj-9" is not connected to any channel')
  })
})

describe('EditorPlots', () => {
  it('draws three plots for the selected junction and names the operating point in figures', async () => {
    const forecast = forecastDocument(doc())
    const f = forecast.junctions[0]!.forecast!
    const w = mount(EditorPlots, { props: { forecast, junctionId: 'tj-1' }, attachTo: document.body })
    await new Promise(r => setTimeout(r, 20))
    expect(w.findAll('figure')).toHaveLength(3)
    expect(w.get('[data-test="plot-current"]').text()).toContain(`φ = ${Number(f.flowRateRatio.value.toPrecision(3))}`)
    expect(w.get('[data-test="plot-ratio"] [role="img"]').attributes('aria-label')).toContain('flow-rate ratio')
    w.unmount()
  })

  it('asks for a junction when none is selected', () => {
    const w = mount(EditorPlots, { props: { forecast: forecastDocument(doc()), junctionId: null } })
    expect(w.text()).toContain('Select a connected junction')
  })
})
