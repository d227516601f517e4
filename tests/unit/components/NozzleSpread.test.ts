// Arrays answer the reviewer's question (issue 16 item 6): a 256-nozzle chip shows its spread at a glance, and the
// table opens, sorts and exports CSV.
import { mount } from '@vue/test-utils'
import Papa from 'papaparse'
import { describe, expect, it } from 'vitest'
import RevisionForecast from '../../../components/revision/RevisionForecast.vue'
import EditorJunctionTable from '../../../components/editor/EditorJunctionTable.vue'
import { parseChipDocument } from '../../../shared/schemas/chip'
import { forecastDocument } from '../../../shared/physics/document'
import { actions, runAction } from '../../../shared/editor'
import fixture from '../../fixtures/documents/t-junction-basic.json'
import { flowFromDrops, nozzleCsv, nozzleGroups, spreadOf } from '../../../utils/nozzleSpread'

// An invented 256-nozzle ladder whose drops grow slowly along the manifold (the far end gets less pressure).
const nozzles = Array.from({ length: 256 }, (_, k) => ({
  id: `ladder-1[${k}]`,
  kind: 'step-array',
  regime: 'step-emulsification',
  dropletDiameterUm: 40 + k * 0.01,
  frequencyHz: 900 - k,
  valid: true,
}))
const summary = {
  junctionKinds: ['step-array'],
  counts: { channels: 1, components: 1, ports: 2, layers: 1 },
  operatingPoint: 'op-1',
  junctions: [
    { id: 'tj-1', kind: 't-junction', regime: 'squeezing', dropletDiameterUm: 52, frequencyHz: 135.4, valid: true },
    ...nozzles,
  ],
  inlets: [{ portId: 'oil-in', pressureMbar: 120, flowUlPerMin: 5 }],
  forecastError: null,
  findings: { errors: 0, warnings: 1, infos: 0 },
  processId: 'pdms-soft-litho',
}

describe('spread across nozzles', () => {
  it('min, max, mean and CV with the sample standard deviation', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, sample variance 32/7 (the textbook example of the standard deviation).
    const s = spreadOf([2, 4, 4, 4, 5, 5, 7, 9, null])!
    expect(s).toMatchObject({ count: 8, min: 2, max: 9, mean: 5 })
    expect(s.cv).toBeCloseTo(Math.sqrt(32 / 7) / 5, 12)
  })

  it('flow from drops by continuity: 1 kHz of 40 µm drops is 2.01 µL/min', () => {
    // π (40 µm)³ / 6 = 33 510 µm³ = 33.5 pL; × 1000 /s × 60 s/min = 2.0106 µL/min.
    expect(flowFromDrops(40, 1000)).toBeCloseTo(2.0106, 4)
  })

  it('groups nozzles by array, numbers them along the manifold and exports every one as CSV', () => {
    const [g] = nozzleGroups(summary.junctions)
    expect(g!.rows).toHaveLength(256)
    const csv = Papa.parse<string[]>(nozzleCsv(g!), { skipEmptyLines: true }).data
    expect(csv[0]).toEqual([
      'array',
      'nozzle',
      'droplet_diameter_um',
      'generation_rate_hz',
      'dispersed_flow_ul_per_min',
      'inside_validity',
    ])
    expect(csv).toHaveLength(257)
    expect(csv[256]!.slice(0, 4)).toEqual(['ladder-1', '256', String(40 + 255 * 0.01), String(900 - 255)])
  })

  it('separate junctions of one kind placed as a bank (the array tool) are read as one bank', () => {
    const bank = Array.from({ length: 16 }, (_, k) => ({
      id: `sn-${k + 1}`,
      kind: 'step-nozzle',
      dropletDiameterUm: 30 + k,
      frequencyHz: 500,
      valid: k < 15,
    }))
    const groups = nozzleGroups([
      ...bank,
      { id: 'tj-1', kind: 't-junction', dropletDiameterUm: 50, frequencyHz: 100, valid: true },
    ])
    expect(groups).toHaveLength(1)
    expect(groups[0]).toMatchObject({ array: 'bank:step-nozzle', bank: true })
    expect(groups[0]!.rows.map(r => r.id)).toEqual(bank.map(b => b.id))
    expect(groups[0]!.diameter).toMatchObject({ min: 30, max: 45 })
  })

  it('a bank reads "Bank of step nozzles" and nozzles that agree read one value, not "32 µm – 32 µm"', () => {
    const bank = Array.from({ length: 64 }, (_, k) => ({
      id: `sn-${k + 1}`,
      kind: 'step-nozzle',
      regime: 'step-emulsification',
      dropletDiameterUm: 32.0004 + k * 1e-5,
      frequencyHz: 340 + k * 0.1,
      valid: true,
    }))
    const w = mount(RevisionForecast, { props: { summary: { ...summary, junctions: bank } as never } })
    const spread = w.get('[data-test="nozzle-spread-bank-step-nozzle"]')
    expect(spread.get('h3').text()).toBe('Bank of step nozzles: spread across 64 nozzles')
    expect(w.get('[data-test="spread-diameter"]').text()).toBe('32 µm at every nozzle')
    expect(spread.text()).toContain('340 Hz – 346 Hz, mean 343 Hz')
  })

  it('the revision page shows the spread, not "and 244 more junctions"; the table expands and sorts', async () => {
    const w = mount(RevisionForecast, { props: { summary: summary as never }, attachTo: document.body })
    expect(w.text()).not.toMatch(/more junctions/)
    const spread = w.get('[data-test="nozzle-spread-ladder-1"]')
    expect(spread.text()).toContain('256 nozzles')
    expect(w.get('[data-test="spread-diameter"]').text()).toBe('40 µm – 42.5 µm, mean 41.3 µm')
    expect(spread.find('[role="img"]').exists()).toBe(true)
    expect(w.findAll('[data-test="nozzle-row"]')).toHaveLength(0)
    await w.get('[data-test="nozzle-toggle"]').trigger('click')
    expect(w.findAll('[data-test="nozzle-row"]')).toHaveLength(256)
    await w.get('[data-test="nozzle-sort-frequencyHz"]').trigger('click')
    expect(w.findAll('[data-test="nozzle-row"]')[0]!.find('td').text()).toBe('256')
    await w.get('[data-test="nozzle-sort-frequencyHz"]').trigger('click')
    expect(w.findAll('[data-test="nozzle-row"]')[0]!.find('td').text()).toBe('1')
    expect(w.get('[data-test="forecast-tj-1"]').text()).toContain('T-junction “tj-1”')
    w.unmount()
  })

  it('the editor shows the same spread for a bank placed with the array tool (16 step nozzles, real forecast)', async () => {
    const parsed = parseChipDocument(structuredClone(fixture))
    if (!parsed.ok) throw new Error('fixture')
    const r = runAction(parsed.document, actions.placeArray, {
      kind: 'step-nozzle',
      count: 16,
      pitch: 80,
      mode: 'replace',
    })
    if (!r.ok) throw new Error(r.refusal.message)
    const forecast = forecastDocument(r.doc)
    const firstNozzle = r.doc.components.find(c => c.kind === 'step-nozzle')!.id
    const w = mount(EditorJunctionTable, { props: { forecast, junctionId: firstNozzle }, attachTo: document.body })
    const spread = w.find('[data-test^="nozzle-spread-"]')
    expect(spread.exists()).toBe(true)
    expect(spread.text()).toContain('16 nozzles')
    expect(w.get('[data-test="spread-flow"]').text()).toMatch(/µL\/min – .* µL\/min, mean/)
    w.unmount()
  })
})
