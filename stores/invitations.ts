import { defineStore } from 'pinia'
import type { InvitationCreate } from '~~/shared/schemas/invitations'
import type { PendingInvitation } from '~~/shared/types/invitations'

/** A lab's open invitations, for its admins. */
export const useInvitationsStore = defineStore('invitations', () => {
  const pending = ref<PendingInvitation[]>([])
  const labId = ref<string | null>(null)
  const { busy, problem, run } = useApiCall()
  const lastSentTo = ref<string | null>(null)

  async function load(lab: string) {
    labId.value = lab
    lastSentTo.value = null
    await run(async () => {
      pending.value = await useRequestFetch()<PendingInvitation[]>(`/api/labs/${lab}/invitations`)
    })
  }

  async function invite(body: InvitationCreate): Promise<boolean> {
    const created = await run(() =>
      $fetch<PendingInvitation>(`/api/labs/${labId.value}/invitations`, { method: 'POST', body }),
    )
    if (!created) return false
    pending.value = [created, ...pending.value.filter(i => i.email !== created.email)]
    lastSentTo.value = created.email
    return true
  }

  async function revoke(id: string) {
    const done = await run(async () => {
      await $fetch(`/api/labs/${labId.value}/invitations/${id}`, { method: 'DELETE' })
      return true
    })
    if (done) pending.value = pending.value.filter(i => i.id !== id)
  }

  return { pending, problem, busy, lastSentTo, load, invite, revoke }
})
