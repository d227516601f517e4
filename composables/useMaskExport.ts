// A large chip's mask DXF, made by the background job (`POST …/dxf-exports`): start it, follow it every second,
// and hand the file to the browser when it is ready. `state` says where it is, in words, for the button.
import { useIntervalFn } from '@vueuse/core'
import type { MaskExport } from '#shared/types/designs'

export function useMaskExport(base: () => string) {
  const job = ref<MaskExport | null>(null)
  const problem = ref<string | null>(null)
  const busy = computed(() => job.value?.status === 'queued' || job.value?.status === 'making')
  const { pause, resume } = useIntervalFn(follow, 1000, { immediate: false })

  async function follow() {
    if (!job.value) return pause()
    try {
      job.value = await $fetch<MaskExport>(`${base()}/dxf-exports/${job.value.exportId}`)
    } catch (error) {
      problem.value = (error as { data?: { message?: string } }).data?.message ?? 'Could not follow the mask export'
      job.value = null
    }
    if (job.value?.status === 'ready') window.location.assign(job.value.fileUrl)
    if (job.value?.status === 'failed') problem.value = `The mask could not be made: ${job.value.error}`
    if (!busy.value) pause()
  }

  async function start(query: string) {
    problem.value = null
    try {
      job.value = await $fetch<MaskExport>(`${base()}/dxf-exports${query}`, { method: 'POST' })
      resume()
    } catch (error) {
      problem.value = (error as { data?: { message?: string } }).data?.message ?? 'Could not start the mask export'
    }
  }

  return { job, busy, problem, start }
}
