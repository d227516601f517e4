// The lab's library table as an admin reads it (issue 16, the final walk): a pair's values name its liquids and
// surfactant rather than their document keys, numbers go through shared/format and "changed" is a day in the
// viewer's locale, not "12/3/2026".
import { mount } from '@vue/test-utils'
import { describe, expect, it, vi } from 'vitest'
import LibraryEntries from '../../../components/library/LibraryEntries.vue'
import { formatDate, type DateContext } from '../../../shared/format/date'
import type { LibraryEntryView } from '../../../shared/schemas/libraries'

// The page's date composable (auto-imported in the app): the viewer's locale and zone, here en-GB in UTC.
vi.stubGlobal(
  'useWhen',
  () =>
    (iso: string, context: DateContext = 'moment') =>
      formatDate(iso, context, { locale: 'en-GB', timeZone: 'UTC' }),
)

const base = {
  source: 'measured in our lab',
  archived: false,
  updatedAt: '2026-12-03T14:10:00.000Z',
  updatedByName: 'Ada Admin',
}
const entries: LibraryEntryView[] = [
  {
    ...base,
    id: 'l1',
    kind: 'liquid',
    key: 'lab-bench-oil',
    name: 'Bench oil, lot 9',
    values: { table: [{ temperatureC: 25, viscosityMPaS: 3.25, densityKgPerM3: 805.5 }] },
  },
  {
    ...base,
    id: 'p1',
    kind: 'pair',
    key: 'lab-bench-oil/water/sorbitan-monooleate',
    name: 'Water in bench oil',
    values: { liquids: ['water', 'lab-bench-oil'], surfactant: 'sorbitan-monooleate', interfacialTensionMNPerM: 3.6 },
  },
]

describe('LibraryEntries', () => {
  it('a pair reads its liquids and surfactant by name; the key keeps its own column; the day reads 3 Dec 2026', () => {
    const w = mount(LibraryEntries, { props: { kind: 'pair', entries, canManage: false } })
    const cells = w
      .get('[data-test="library-entry-lab-bench-oil/water/sorbitan-monooleate"]')
      .findAll('td')
      .map(c => c.text())
    expect(cells[1]).toBe('lab-bench-oil/water/sorbitan-monooleate')
    expect(cells[2]).toBe('water in Bench oil, lot 9, sorbitan monooleate: 3.6 mN/m')
    expect(cells[4]).toBe('3 Dec 2026 · Ada Admin')
  })

  it("a liquid's values as typed, with their units", () => {
    const w = mount(LibraryEntries, { props: { kind: 'liquid', entries, canManage: true } })
    expect(w.get('[data-test="library-entry-lab-bench-oil"]').findAll('td')[2]!.text()).toBe(
      '25 °C: 3.25 mPa·s, 805.5 kg/m³',
    )
  })
})
