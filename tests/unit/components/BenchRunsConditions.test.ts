// The runs table shows what was set at the bench for each run (issue 13): flows or pressures, temperature and
// liquids with their units, or that the run kept the design's operating point.
import { mount } from '@vue/test-utils'
import { describe, expect, it, vi } from 'vitest'
import BenchRunsTable from '../../../components/bench/BenchRunsTable.vue'
import { conditionsLabel } from '../../../composables/benchFormat'
import { benchConditions } from '../../../shared/schemas/bench'

// Nuxt auto-imports useWhen in the app; here it is the identity.
vi.stubGlobal('useWhen', () => (iso: string) => iso)

describe('bench conditions in words', () => {
  it('writes flows, pressures, temperature and liquids with units, as typed', () => {
    const c = benchConditions.parse({
      continuousFlow: { value: 12.5, unit: 'uL/min' },
      dispersedPressureMbar: 85,
      temperatureC: 24,
      continuousLiquid: 'light oil',
      dispersedLiquid: 'buffer',
      surfactant: '2 % surfactant',
    })
    expect(conditionsLabel(c)).toBe('Qc 12.5 µL/min · Pd 85 mbar · 24 °C · light oil / buffer · 2 % surfactant')
    expect(conditionsLabel({ dispersedFlow: { value: 300, unit: 'nL/min' } })).toBe('Qd 300 nL/min')
    expect(conditionsLabel({})).toBe('')
    expect(conditionsLabel(null)).toBe('')
  })

  it('the runs table has a column for them', () => {
    const run = (conditions: Record<string, unknown>) => ({
      id: `run-${Math.random()}`,
      revisionId: 'r',
      designId: 'd',
      operatingPointId: null,
      junctionId: null,
      conditions,
      asBuilt: null,
      quantity: 'diameter',
      source: 'typed',
      count: 20,
      meanUm: 80,
      sdUm: 1,
      cv: 0.0125,
      frequencyHz: null,
      predicted: null,
      relativeError: null,
      notes: '',
      ranBy: 'u',
      ranByName: 'Someone',
      ranAt: '2026-11-30T10:00:00Z',
      micrographs: [],
    })
    const w = mount(BenchRunsTable, {
      props: { runs: [run({ continuousFlow: { value: 10, unit: 'uL/min' }, temperatureC: 21.5 }), run({})] as never },
    })
    expect(w.get('thead').text()).toContain('At the bench')
    expect(w.get('[data-test="bench-conditions-1"]').text()).toBe('Qc 10 µL/min · 21.5 °C')
    expect(w.get('[data-test="bench-conditions-2"]').text()).toBe("the design's operating point")
  })
})
