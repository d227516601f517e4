import { defineStore } from 'pinia'
import type { LabMember } from '~~/shared/types/session'
import type { Role } from '~~/shared/utils/roles'

export const useMembersStore = defineStore('members', () => {
  const members = ref<LabMember[]>([])
  const labId = ref<string | null>(null)
  const { busy, problem, run } = useApiCall()

  async function load(lab: string) {
    labId.value = lab
    await run(async () => {
      members.value = await useRequestFetch()<LabMember[]>(`/api/labs/${lab}/members`)
    })
  }

  async function changeRole(userId: string, role: Role) {
    const url: string = `/api/labs/${labId.value}/members/${userId}`
    const updated = await run(() => $fetch<LabMember>(url, { method: 'PATCH', body: { role } }))
    if (updated) members.value = members.value.map(m => (m.userId === userId ? updated : m))
  }

  async function remove(userId: string) {
    const url: string = `/api/labs/${labId.value}/members/${userId}`
    const done = await run(async () => {
      await $fetch(url, { method: 'DELETE' })
      return true
    })
    if (done) members.value = members.value.filter(m => m.userId !== userId)
  }

  return { members, problem, busy, load, changeRole, remove }
})
