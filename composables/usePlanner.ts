// Runs planner requests in a Web Worker (planner.worker.ts, called through comlink) so a window scan never freezes
// the page; in the page itself where there is no worker (tests of components, old browsers). Only the latest
// request's answer is kept: an older one arriving later is dropped.
import { onScopeDispose, ref, shallowRef, toRaw } from 'vue'
import { wrap, type Remote } from 'comlink'
import type { PlanAnswer, PlanContext } from '#shared/physics/planner'
import { runPlanRequest, type PlanJob, type PlanResult } from '~~/utils/plannerRun'

type PlannerApi = { plan: typeof runPlanRequest }

export function usePlanner() {
  const answer = shallowRef<PlanAnswer | null>(null)
  const error = ref<string | null>(null)
  const issues = ref<PlanResult['issues']>([])
  const busy = ref(false)
  const elapsedMs = ref<number | null>(null)
  let seq = 0
  let worker: Worker | null = null
  let api: Remote<PlannerApi> | null = null
  let started = 0

  function done(n: number, r: PlanResult) {
    if (n !== seq) return
    busy.value = false
    elapsedMs.value = performance.now() - started
    answer.value = r.answer
    error.value = r.error
    issues.value = r.issues
  }

  function ensureWorker(): Remote<PlannerApi> | null {
    if (api || typeof Worker === 'undefined') return api
    try {
      worker = new Worker(new URL('../components/editor/lib/planner.worker.ts', import.meta.url), { type: 'module' })
      worker.addEventListener('error', () => {
        api = null
      })
      api = wrap<PlannerApi>(worker)
    } catch {
      api = null
    }
    return api
  }

  /** Starts a plan; a newer call supersedes an older one still running. `lab`: the lab's library the request may name. */
  function plan(request: unknown, lab?: PlanContext['lab']) {
    const n = ++seq
    busy.value = true
    error.value = null
    started = performance.now()
    const job: PlanJob = {
      request: JSON.parse(JSON.stringify(toRaw(request))),
      lab: lab ? JSON.parse(JSON.stringify(toRaw(lab))) : null,
    }
    const w = ensureWorker()
    if (w) void w.plan(job).then(r => done(n, r))
    else setTimeout(() => done(n, runPlanRequest(job)), 0)
  }

  onScopeDispose(() => {
    worker?.terminate()
    worker = null
    api = null
  })
  return { answer, error, issues, busy, elapsedMs, plan }
}
