// A large chip's revision while its summary is computed in the background: the forecast panel and the revision list
// say so, and show no "0 errors" or empty forecast as if it were a result.
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import DesignRevisions from '../../../components/design/DesignRevisions.vue'
import RevisionForecast from '../../../components/revision/RevisionForecast.vue'

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
})
