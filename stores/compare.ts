import { defineStore } from 'pinia'
import type { RevisionDetail } from '~~/shared/types/designs'

/** Two revisions side by side: `older` is drawn as the base, `newer` on top. */
export const useCompareStore = defineStore('compare', () => {
  const newer = ref<RevisionDetail | null>(null)
  const older = ref<RevisionDetail | null>(null)
  const { busy, problem, run } = useApiCall()
  async function load(labId: string, a: string, b: string) {
    const api = useRequestFetch()
    await run(async () => {
      const [x, y] = await Promise.all([a, b].map(id => api<RevisionDetail>(`/api/labs/${labId}/revisions/${id}`)))
      ;[older.value, newer.value] = x!.number <= y!.number ? [x!, y!] : [y!, x!]
    })
  }
  return { newer, older, busy, problem, load }
})
