import { defineStore } from 'pinia'
import type { BenchRunCreate } from '~~/shared/schemas/bench'
import type { BenchRunInfo, BenchRunList, CalibrationAnswer, MicrographResult } from '~~/shared/types/bench'

/** Bench runs of one revision, the open micrograph, and the lab's calibration for the revision's design. */
export const useBenchStore = defineStore('bench', () => {
  const list = ref<BenchRunList | null>(null)
  const calibration = ref<CalibrationAnswer | null>(null)
  const micrograph = ref<MicrographResult | null>(null)
  const uploading = ref<{ fileName: string; phase: 'uploading' | 'measuring'; fraction: number } | null>(null)
  const labId = ref('')
  const { busy, problem, run } = useApiCall()

  async function load(lab: string, revisionId: string) {
    labId.value = lab
    const api = useRequestFetch()
    await run(async () => {
      list.value = await api<BenchRunList>(`/api/labs/${lab}/revisions/${revisionId}/bench-runs`)
      calibration.value = await api<CalibrationAnswer>(`/api/labs/${lab}/calibrations`, {
        query: { designId: list.value.revision.designId },
      })
    })
  }

  const refresh = () => (list.value ? load(labId.value, list.value.revision.id) : Promise.resolve())

  async function record(body: BenchRunCreate): Promise<BenchRunInfo | undefined> {
    const url: string = `/api/labs/${labId.value}/revisions/${list.value!.revision.id}/bench-runs`
    const created = await run(() => $fetch<BenchRunInfo>(url, { method: 'POST', body }))
    if (created) await refresh()
    return created
  }

  /** Uploads with progress (XMLHttpRequest: fetch reports no upload progress), then the server measures. */
  function upload(
    runId: string,
    file: File,
    scale: { umPerPx?: number; barPx?: number; barUm?: number },
  ): Promise<MicrographResult | undefined> {
    problem.value = null
    const form = new FormData()
    form.set('image', file, file.name)
    for (const [k, v] of Object.entries(scale)) if (v !== undefined) form.set(k, String(v))
    uploading.value = { fileName: file.name, phase: 'uploading', fraction: 0 }
    return new Promise(resolve => {
      const xhr = new XMLHttpRequest()
      xhr.open('POST', `/api/labs/${labId.value}/bench-runs/${runId}/micrographs`)
      xhr.upload.onprogress = e => {
        if (e.lengthComputable && uploading.value) uploading.value.fraction = e.loaded / e.total
      }
      xhr.upload.onload = () => {
        if (uploading.value) uploading.value = { ...uploading.value, phase: 'measuring', fraction: 1 }
      }
      xhr.onload = async () => {
        uploading.value = null
        let json: any = null
        try {
          json = JSON.parse(xhr.responseText)
        } catch {
          /* not JSON */
        }
        if (xhr.status === 202) {
          // Still measuring in the background: follow the row until it is done.
          uploading.value = { fileName: file.name, phase: 'measuring', fraction: json.micrograph.progress }
          for (;;) {
            await new Promise(r => setTimeout(r, 1000))
            const next = await $fetch<MicrographResult>(
              `/api/labs/${labId.value}/bench-runs/${runId}/micrographs/${json.micrograph.id}`,
            ).catch(() => null)
            if (next && next.micrograph.status !== 'done' && next.micrograph.status !== 'failed') {
              uploading.value = { fileName: file.name, phase: 'measuring', fraction: next.micrograph.progress }
              continue
            }
            uploading.value = null
            if (next?.micrograph.status === 'done') {
              micrograph.value = next
              await refresh()
              resolve(next)
            } else {
              problem.value = {
                status: 422,
                message: `The micrograph could not be measured: ${next?.micrograph.error ?? 'try again'}`,
                fields: {},
              }
              resolve(undefined)
            }
            return
          }
        }
        if (xhr.status === 201) {
          micrograph.value = json as MicrographResult
          await refresh()
          resolve(json)
        } else {
          problem.value = toApiProblem({ statusCode: xhr.status, data: json })
          resolve(undefined)
        }
      }
      xhr.onerror = () => {
        uploading.value = null
        problem.value = {
          status: 0,
          message: 'The upload was interrupted; check the connection and try again.',
          fields: {},
        }
        resolve(undefined)
      }
      xhr.send(form)
    })
  }

  async function openMicrograph(runId: string, micrographId: string) {
    const r = await run(() =>
      $fetch<MicrographResult>(`/api/labs/${labId.value}/bench-runs/${runId}/micrographs/${micrographId}`),
    )
    if (r) micrograph.value = r
  }

  async function exclude(excluded: number[]) {
    const m = micrograph.value!.micrograph
    const url: string = `/api/labs/${labId.value}/bench-runs/${m.runId}/micrographs/${m.id}`
    const r = await run(() => $fetch<MicrographResult>(url, { method: 'PATCH', body: { excluded } }))
    if (r) {
      micrograph.value = r
      await refresh()
    }
    return r !== undefined
  }

  async function setMode(mode: 'model' | 'lab-calibrated') {
    const designId = list.value!.revision.designId
    const url: string = `/api/labs/${labId.value}/calibrations/forecast-mode`
    const done = await run(() =>
      $fetch<{ designId: string; mode: string }>(url, { method: 'PUT', body: { designId, mode } }),
    )
    if (done)
      calibration.value = await $fetch<CalibrationAnswer>(`/api/labs/${labId.value}/calibrations`, {
        query: { designId },
      })
  }

  return {
    labId,
    list,
    calibration,
    micrograph,
    uploading,
    busy,
    problem,
    load,
    record,
    upload,
    openMicrograph,
    exclude,
    setMode,
  }
})
