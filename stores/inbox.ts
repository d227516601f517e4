import { defineStore } from 'pinia'
import type { ReviewInbox } from '~~/shared/types/inbox'

// The lab overview's lists: recent designs, revisions waiting for my review, my open comment threads.
export const useInboxStore = defineStore('inbox', () => {
  const inbox = ref<ReviewInbox | null>(null)
  const { busy, problem, run } = useApiCall()
  async function load(labId: string) {
    await run(async () => {
      inbox.value = await useRequestFetch()<ReviewInbox>(`/api/labs/${labId}/inbox`)
    })
  }
  return { inbox, busy, problem, load }
})
