// A large chip's revision while its summary is computed in the background: the forecast panel and the revision list
// say so, and show no "0 errors" or empty forecast as if it were a result.
import { mount } from '@vue/test-utils'
import { describe, expect, it, vi } from 'vitest'
import DesignRevisions from '../../../components/design/DesignRevisions.vue'
import RevisionForecast from '../../../components/revision/RevisionForecast.vue'
import FabAsBuiltReport from '../../../components/fab/FabAsBuiltReport.vue'

vi.stubGlobal('useWhen', () => (iso: string) => iso)

const pending = {
  junctionKinds: ['step-array'],
  counts: { channels: 4101, components: 1, ports: 3, layers: 2 },
  operatingPoint: null,
  junctions: [],
  inlets: [],
  forecastError: null,
  findings: { errors: 0, warnings: 0, infos: 0 },
  processId: 'film-mask-soft-litho',
  pending: true,
}

describe('a pending revision summary', () => {
  it('the forecast panel says it is being computed and shows no rule count', () => {
    const w = mount(RevisionForecast, { props: { summary: pending as never } })
    expect(w.get('[data-test="summary-pending"]').text()).toContain('being computed in the background')
    expect(w.get('[data-test="summary-pending"]').text()).toContain('4101 channels')
    expect(w.text()).not.toContain('Design rules:')
    expect(w.text()).not.toMatch(/no errors|0 errors/)
  })

  it('a finished summary has no pending panel and does show the rule count', () => {
    const { pending: _, ...done } = pending
    const w = mount(RevisionForecast, { props: { summary: done as never } })
    expect(w.find('[data-test="summary-pending"]').exists()).toBe(false)
    expect(w.text()).toContain('Design rules:')
  })

  it('the revision list says "being checked…" instead of "no errors"', () => {
    const row = {
      id: 'r1',
      designId: 'd',
      number: 1,
      parentId: null,
      message: 'm1',
      authorName: 'A',
      createdAt: '2026-01-01T00:00:00Z',
      status: 'draft',
      statusChangedAt: '2026-01-01T00:00:00Z',
      summary: pending,
    }
    const w = mount(DesignRevisions, {
      props: { revisions: [row] as never, labId: 'l', latestId: 'r1' },
      global: { stubs: { NuxtLink: { template: '<a><slot /></a>' }, DesignStatusBadge: true } },
    })
    expect(w.get('[data-test="summary-pending"]').text()).toBe('being checked…')
    expect(w.text()).not.toContain('no errors')
  })

  it('the as-built report says its comparison is being computed, with no empty table', () => {
    const report = (pending: boolean) => ({
      document: { layers: [] },
      layers: [],
      measurable: [],
      asBuilt: { id: 'a', recordedBy: 'Fab', createdAt: '2026-12-01', note: '', pending, changes: [], files: [] },
    })
    const mountWith = (pending: boolean) =>
      mount(FabAsBuiltReport, {
        props: {
          report: report(pending) as never,
          canRecord: false,
          busy: false,
          problem: null,
          serverFields: {},
          base: '',
        },
        global: { stubs: { FabAsBuiltFiles: true, FabAsBuiltForm: true } },
      })
    const waiting = mountWith(true)
    expect(waiting.get('[data-test="as-built-pending"]').text()).toContain('being computed in the background')
    expect(waiting.find('[data-test="as-built-changes"]').exists()).toBe(false)
    const done = mountWith(false)
    expect(done.find('[data-test="as-built-pending"]').exists()).toBe(false)
    expect(done.find('[data-test="as-built-changes"]').exists()).toBe(true)
  })
})
