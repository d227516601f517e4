import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import LabMembersTable from '../../../components/lab/LabMembersTable.vue'
import type { LabMember } from '../../../shared/types/session'

const members: LabMember[] = [
  { userId: 'u1', name: 'Ada Admin', email: 'a@x.example', role: 'admin', since: '2026-01-02T00:00:00.000Z' },
  { userId: 'u2', name: 'Dee Designer', email: 'd@x.example', role: 'designer', since: '2026-03-04T00:00:00.000Z' },
]

describe('LabMembersTable', () => {
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
