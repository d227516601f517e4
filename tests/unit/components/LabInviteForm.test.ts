import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import LabInviteForm from '../../../components/lab/LabInviteForm.vue'

describe('LabInviteForm', () => {
  it('checks the address with the shared schema before emitting, and emits it trimmed and lower-cased', async () => {
    const w = mount(LabInviteForm, { props: { busy: false, fields: {}, sentTo: null } })
    await w.get('#invite-email').setValue('not an address')
    await w.get('form').trigger('submit')
    expect(w.emitted('invite')).toBeUndefined()
    expect(w.text()).toContain('Enter an e-mail address')
    await w.get('#invite-email').setValue('  Ines@Lab.Example ')
    await w.get('#invite-role').setValue('reviewer')
    await w.get('form').trigger('submit')
    expect(w.emitted('invite')).toEqual([[{ email: 'ines@lab.example', role: 'reviewer' }]])
  })

  it("shows the server's field message and clears the address once sent", async () => {
    const w = mount(LabInviteForm, {
      props: { busy: false, fields: { email: 'Already a member of this lab' }, sentTo: null },
    })
    expect(w.text()).toContain('Already a member of this lab')
    await w.get('#invite-email').setValue('a@lab.example')
    await w.setProps({ fields: {}, sentTo: 'a@lab.example' })
    expect((w.get('#invite-email').element as HTMLInputElement).value).toBe('')
    expect(w.get('[data-test="invite-sent"]').text()).toBe('Invitation sent to a@lab.example.')
  })
})
