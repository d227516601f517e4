import { defineStore } from 'pinia'
import type { LabOutbox } from '~~/shared/types/outbox'

/** The development outbox: whether this server has one, and a lab's kept and waiting messages. */
export const useOutboxStore = defineStore('outbox', () => {
  const available = ref<boolean | null>(null)
  const box = ref<LabOutbox>({ messages: [], waiting: [] })
  const problem = ref<ApiProblem | null>(null)
  const busy = ref(false)

  async function checkAvailable() {
    if (available.value !== null) return
    try {
      available.value = (await useRequestFetch()<{ available: boolean }>('/api/dev/outbox')).available
    } catch {
      // signed out or offline: ask again later
    }
  }

  async function load(labId: string) {
    busy.value = true
    problem.value = null
    try {
      box.value = await useRequestFetch()<LabOutbox>(`/api/labs/${labId}/outbox`)
    } catch (error) {
      problem.value = toApiProblem(error)
    } finally {
      busy.value = false
    }
  }

  return { available, box, problem, busy, checkAvailable, load }
})
