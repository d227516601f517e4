import { mount } from '@vue/test-utils'
import { describe, expect, it, vi } from 'vitest'
import { formatDate, type DateContext } from '../../../shared/format/date'
import LabMembersTable from '../../../components/lab/LabMembersTable.vue'
import type { LabMember } from '../../../shared/types/session'

const members: LabMember[] = [
  { userId: 'u1', name: 'Ada Admin', email: 'a@x.example', role: 'admin', since: '2026-01-02T00:00:00.000Z' },
  { userId: 'u2', name: 'Dee Designer', email: 'd@x.example', role: 'designer', since: '2026-03-04T00:00:00.000Z' },
]

// The page's date composable (auto-imported in the app): the viewer's locale and zone, here en-GB in UTC.
vi.stubGlobal(
  'useWhen',
  () =>
    (iso: string, context: DateContext = 'moment') =>
      formatDate(iso, context, { locale: 'en-GB', timeZone: 'UTC' }),
)

describe('LabMembersTable', () => {
  it('writes "member since" as a day in the viewer\'s locale, not "2026-01-02"', () => {
    const w = mount(LabMembersTable, { props: { members, canManage: false, currentUserId: 'u2', busy: false } })
    expect(w.findAll('[data-test="member-since"]').map(c => c.text())).toEqual(['2 Jan 2026', '4 Mar 2026'])
  })
  it('shows roles as text to someone who may not manage', () => {
    const w = mount(LabMembersTable, { props: { members, canManage: false, currentUserId: 'u2', busy: false } })
    expect(w.findAll('select')).toHaveLength(0)
    expect(w.findAll('button')).toHaveLength(0)
    expect(w.text()).toContain('Designer')
    expect(w.get('[data-test="member-d@x.example"]').text()).toContain('(you)')
  })
  it('emits a role change and a removal for a manager, without touching its props', async () => {
    const w = mount(LabMembersTable, { props: { members, canManage: true, currentUserId: 'u1', busy: false } })
    await w.findAll('select')[1]!.setValue('reviewer')
    expect(w.emitted('changeRole')).toEqual([['u2', 'reviewer']])
    await w.findAll('button')[0]!.trigger('click')
    expect(w.emitted('remove')![0]![0]).toMatchObject({ userId: 'u1' })
    expect(members[1]!.role).toBe('designer')
  })
})
