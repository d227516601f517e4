import { defineStore } from 'pinia'
import type { ActivityEntry, DesignOriginView, DesignRow, RevisionRow } from '~~/shared/types/designs'
import type { DesignCreate } from '~~/shared/schemas/designs'

export interface DesignListQuery {
  q?: string
  status?: string
  kind?: string
  archived?: 'true' | 'false'
  sort?: 'updated' | 'name' | 'created'
  dir?: 'asc' | 'desc'
  page?: number
  pageSize?: number
}
export interface DesignDetail {
  design: {
    id: string
    name: string
    description: string
    processId: string
    createdBy: string
    createdById: string
    createdAt: string
    updatedAt: string
    archived: boolean
    latestRevisionId: string | null
    origin: DesignOriginView | null
  }
  revisions: RevisionRow[]
  activity: ActivityEntry[]
}

/** A lab's designs and the open design. */
export const useDesignsStore = defineStore('designs', () => {
  const rows = ref<DesignRow[]>([])
  const paging = ref({ total: 0, page: 1, pageSize: 50 })
  const detail = ref<DesignDetail | null>(null)
  const { busy, problem, run } = useApiCall()
  // The page's rows come with paging headers, so this one call needs $fetch.raw (useRequestFetch() has no .raw).
  const headers = () => useRequestHeaders(['cookie'])

  async function load(labId: string, query: DesignListQuery = {}) {
    const clean = Object.fromEntries(Object.entries(query).filter(([, v]) => v !== undefined && v !== ''))
    await run(async () => {
      // One page of rows; the server puts the total and the page it answered in headers.
      const res = await $fetch.raw<DesignRow[]>(`/api/labs/${labId}/designs`, { query: clean, headers: headers() })
      rows.value = res._data ?? []
      paging.value = {
        total: Number(res.headers.get('x-total-count') ?? rows.value.length),
        page: Number(res.headers.get('x-page') ?? 1),
        pageSize: Number(res.headers.get('x-page-size') ?? rows.value.length),
      }
    })
  }

  async function loadDetail(labId: string, designId: string) {
    await run(async () => {
      detail.value = await useRequestFetch()<DesignDetail>(`/api/labs/${labId}/designs/${designId}`)
    })
  }

  const create = (labId: string, body: DesignCreate) =>
    run(() => $fetch<{ designId: string; revisionId: string }>(`/api/labs/${labId}/designs`, { method: 'POST', body }))

  async function setArchived(labId: string, designId: string, archived: boolean) {
    const url: string = `/api/labs/${labId}/designs/${designId}`
    const ok = await run(() => $fetch<{ ok: boolean }>(url, { method: 'PATCH', body: { archived } }))
    if (ok) await loadDetail(labId, designId)
  }

  const duplicate = (labId: string, revisionId: string, targetLabId: string, name: string) =>
    run(() =>
      $fetch<{ labId: string; designId: string; revisionId: string }>(
        `/api/labs/${labId}/revisions/${revisionId}/duplicate`,
        { method: 'POST', body: { targetLabId, name } },
      ),
    )

  async function uploadRevision(labId: string, designId: string, parentId: string, message: string, document: unknown) {
    const saved = await run(() =>
      $fetch<{ revisionId: string; number: number }>(`/api/labs/${labId}/designs/${designId}/revisions`, {
        method: 'POST',
        body: { parentId, message, document },
      }),
    )
    if (saved) await loadDetail(labId, designId)
    return saved
  }

  return { rows, paging, detail, busy, problem, load, loadDetail, create, setArchived, duplicate, uploadRevision }
})
