import { defineStore } from 'pinia'
import type { FailedJob } from '~~/shared/types/jobs'

/** The lab's failed background jobs (lab admins). */
export const useJobsStore = defineStore('jobs', () => {
  const failed = ref<FailedJob[]>([])
  const problem = ref<ApiProblem | null>(null)
  const busy = ref(false)

  async function load(labId: string) {
    busy.value = true
    problem.value = null
    try {
      failed.value = (await useRequestFetch()<{ jobs: FailedJob[] }>(`/api/labs/${labId}/jobs/failed`)).jobs
    } catch (error) {
      problem.value = toApiProblem(error)
    } finally {
      busy.value = false
    }
  }

  return { failed, problem, busy, load }
})
