import { defineStore } from 'pinia'
import type { ReviewState, RevisionDetail } from '~~/shared/types/designs'

/** One open revision: its document and summary, and its review. */
export const useRevisionStore = defineStore('revision', () => {
  const revision = ref<RevisionDetail | null>(null)
  const review = ref<ReviewState | null>(null)
  const { busy, problem, run } = useApiCall()
  let base = ''

  async function load(labId: string, revisionId: string) {
    base = `/api/labs/${labId}/revisions/${revisionId}`
    const headers = useRequestHeaders(['cookie'])
    await run(async () => {
      const [r, s] = await Promise.all([$fetch<RevisionDetail>(base, { headers }), $fetch<ReviewState>(`${base}/review`, { headers })])
      revision.value = r
      review.value = s
    })
  }

  async function act(path: string, method: 'POST' | 'PATCH', body: Record<string, unknown>) {
    const done = await run(() => $fetch(`${base}${path}`, { method, body }))
    if (done !== undefined) review.value = await $fetch<ReviewState>(`${base}/review`)
    return done !== undefined
  }

  return {
    revision, review, busy, problem, load,
    requestReview: (reviewerIds: string[]) => act('/review-requests', 'POST', { reviewerIds }),
    pin: (anchor: { x: number, y: number, elementId?: string }, body: string) => act('/threads', 'POST', { anchor, body }),
    reply: (threadId: string, body: string) => act(`/threads/${threadId}/comments`, 'POST', { body }),
    setResolved: (threadId: string, resolved: boolean) => act(`/threads/${threadId}`, 'PATCH', { resolved }),
    verdict: (verdict: 'approve' | 'request-changes', note: string) => act('/verdicts', 'POST', { verdict, note }),
    release: (note: string) => act('/release', 'POST', { note }),
    setFabStatus: (fabStatus: string, note = '') => act('/release', 'PATCH', { fabStatus, note }),
  }
})
