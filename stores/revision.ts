import { defineStore } from 'pinia'
import type { ReviewState, RevisionDetail } from '~~/shared/types/designs'
import type { ReleaseBody } from '~~/shared/schemas/orders'

/** One open revision: its document and summary, and its review. */
export const useRevisionStore = defineStore('revision', () => {
  const revision = ref<RevisionDetail | null>(null)
  const review = ref<ReviewState | null>(null)
  const { busy, problem, run } = useApiCall()
  // Derived from state (not a local variable) so actions work after hydration, when load() ran on the server.
  const base = computed(() =>
    revision.value ? `/api/labs/${revision.value.labId}/revisions/${revision.value.id}` : '',
  )

  async function load(labId: string, revisionId: string) {
    const url = `/api/labs/${labId}/revisions/${revisionId}`
    const api = useRequestFetch()
    await run(async () => {
      const [r, s] = await Promise.all([api<RevisionDetail>(url), api<ReviewState>(`${url}/review`)])
      revision.value = r
      review.value = s
    })
  }

  /** A large chip's summary, filled in by the background job: only the summary is replaced (not the drawing). */
  async function refreshSummary() {
    if (!revision.value) return
    const fresh = await $fetch<RevisionDetail>(base.value).catch(() => null)
    if (fresh && revision.value.id === fresh.id) revision.value.summary = fresh.summary
  }

  async function act(path: string, method: 'POST' | 'PATCH', body: Record<string, unknown>) {
    const url: string = `${base.value}${path}`
    const done = await run(() => $fetch<unknown>(url, { method, body }))
    if (done !== undefined) review.value = await $fetch<ReviewState>(`${base.value}/review`)
    return done !== undefined
  }

  return {
    revision,
    review,
    busy,
    problem,
    load,
    refreshSummary,
    requestReview: (reviewerIds: string[]) => act('/review-requests', 'POST', { reviewerIds }),
    pin: (anchor: { x: number; y: number; elementId?: string }, body: string) =>
      act('/threads', 'POST', { anchor, body }),
    reply: (threadId: string, body: string) => act(`/threads/${threadId}/comments`, 'POST', { body }),
    setResolved: (threadId: string, resolved: boolean) => act(`/threads/${threadId}`, 'PATCH', { resolved }),
    verdict: (verdict: 'approve' | 'request-changes', note: string) => act('/verdicts', 'POST', { verdict, note }),
    release: (body: ReleaseBody) => act('/release', 'POST', body),
  }
})
