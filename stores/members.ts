import { defineStore } from 'pinia'
import type { LabMember } from '~~/shared/types/session'
import type { Role } from '~~/shared/utils/roles'

export const useMembersStore = defineStore('members', () => {
  const members = ref<LabMember[]>([])
  const labId = ref<string | null>(null)
  const problem = ref<ApiProblem | null>(null)
  const busy = ref(false)

  async function run<T>(work: () => Promise<T>): Promise<T | undefined> {
    busy.value = true
    problem.value = null
    try {
      return await work()
    } catch (error) {
      problem.value = toApiProblem(error)
    } finally {
      busy.value = false
    }
  }

  async function load(lab: string) {
    labId.value = lab
    await run(async () => {
      members.value = await $fetch<LabMember[]>(`/api/labs/${lab}/members`, { headers: useRequestHeaders(['cookie']) })
    })
  }

  async function changeRole(userId: string, role: Role) {
    const updated = await run(() => $fetch<LabMember>(`/api/labs/${labId.value}/members/${userId}`, { method: 'PATCH', body: { role } }))
    if (updated) members.value = members.value.map(m => (m.userId === userId ? updated : m))
  }

  async function remove(userId: string) {
    const done = await run(async () => {
      await $fetch(`/api/labs/${labId.value}/members/${userId}`, { method: 'DELETE' })
      return true
    })
    if (done) members.value = members.value.filter(m => m.userId !== userId)
  }

  return { members, problem, busy, load, changeRole, remove }
})
