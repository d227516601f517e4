// The compare table as a reviewer reads it (issue 16, the final walk): an inlet's setting never splits ("0.8" on one
// line and "µL/min" on the next at 1440 px, "oil-" above "in" at 1024 px), and a channel's new path reads as its
// points, not JSON.
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import RevisionCompareTable from '../../../components/revision/RevisionCompareTable.vue'

const summary = { junctions: [], inlets: [], counts: {}, findings: { errors: 0, warnings: 0, infos: 0 } }
const inlets = (oil: number, water: number) => [
  { portId: 'oil-in', mode: 'flow', value: oil, unit: 'uL/min' },
  { portId: 'water-in', mode: 'flow', value: water, unit: 'uL/min' },
]
const diff = {
  added: [],
  removed: [],
  changed: ['oil-feed'],
  entries: [
    {
      collection: 'operatingPoints',
      id: 'op-1',
      status: 'changed',
      fields: [{ path: 'inlets', before: inlets(0.8, 0.4), after: inlets(0.6, 0.3) }],
    },
    {
      collection: 'ports',
      id: 'water-in',
      status: 'changed',
      kind: 'inlet',
      fields: [{ path: 'feed', before: { phase: 'continuous' }, after: { phase: 'dispersed' } }],
    },
    {
      collection: 'channels',
      id: 'oil-feed',
      status: 'changed',
      fields: [
        {
          path: 'points',
          before: [
            { x: 0, y: 0 },
            { x: 10, y: 0 },
          ],
          after: [
            { x: 0, y: 0 },
            { x: 5, y: 5 },
            { x: 10, y: 0 },
          ],
        },
      ],
    },
  ],
}

describe('RevisionCompareTable', () => {
  const w = mount(RevisionCompareTable, {
    props: {
      diff: diff as never,
      before: summary as never,
      after: summary as never,
      beforeLabel: 'r1',
      afterLabel: 'r2',
    },
  })
  it("keeps each inlet's number with its unit and breaks only between inlets", () => {
    const cells = w.get('[data-test="compare-op-1-inlets"]').findAll('td.num')
    expect(cells.map(c => c.text())).toEqual([
      'oil-in 0.8 µL/min, water-in 0.4 µL/min',
      'oil-in 0.6 µL/min, water-in 0.3 µL/min',
    ])
    // An inlet's name and its setting in pieces that never break inside (not after "oil-", not between "0.8" and "µL/min").
    expect(cells[0]!.findAll('span.whitespace-nowrap').map(s => s.text())).toEqual([
      'oil-in',
      '0.8 µL/min',
      'water-in',
      '0.4 µL/min',
    ])
  })
  it("a channel's path reads as its count of points, never JSON", () => {
    const cells = w
      .get('[data-test="compare-oil-feed-points"]')
      .findAll('td.num')
      .map(c => c.text())
    expect(cells).toEqual(['2 points', '3 points'])
  })
  it('any other changed object reads in words, not JSON', () => {
    const cells = w
      .get('[data-test="compare-water-in-feed"]')
      .findAll('td.num')
      .map(c => c.text())
    expect(cells.join(' ')).not.toMatch(/[{}"]/)
    expect(cells[1]).toContain('dispersed')
  })
})
