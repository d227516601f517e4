// The revision list says which revision a branch came from (issue 16 item 9).
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import DesignRevisions from '../../../components/design/DesignRevisions.vue'

const summary = {
  junctionKinds: [],
  counts: { channels: 0, components: 0, ports: 0, layers: 1 },
  operatingPoint: null,
  junctions: [
    { id: 'tj-1', kind: 't-junction', regime: 'squeezing', dropletDiameterUm: 110.4, frequencyHz: 10, valid: true },
  ],
  inlets: [],
  forecastError: null,
  findings: { errors: 1, warnings: 0, infos: 0 },
  processId: 'p',
}
const row = (n: number, parent: number | null) => ({
  id: `r${n}`,
  designId: 'd',
  number: n,
  parentId: parent ? `r${parent}` : null,
  message: `m${n}`,
  authorName: 'A',
  createdAt: '2026-01-01T00:00:00Z',
  status: 'draft',
  statusChangedAt: '2026-01-01T00:00:00Z',
  summary,
})

describe('DesignRevisions', () => {
  it('marks a branch with its origin, writes sizes without exponents and counts in words', () => {
    const w = mount(DesignRevisions, {
      props: { revisions: [row(1, null), row(2, 1), row(3, 1)] as never, labId: 'l', latestId: 'r3' },
      global: { stubs: { NuxtLink: { template: '<a><slot /></a>' }, DesignStatusBadge: true } },
    })
    expect(w.find('[data-test="branch-r3"]').text()).toBe('branched from r1')
    expect(w.find('[data-test="branch-r2"]').exists()).toBe(false)
    expect(w.text()).toContain('110 µm')
    expect(w.text()).not.toMatch(/e\+/)
    expect(w.text()).toContain('1 error')
    expect(w.text()).not.toContain('1 errors')
  })
})
