// Runs planner requests in a Web Worker so a window scan never freezes the page; in the page itself where there
// is no worker (tests of components, old browsers). Only the latest request's answer is kept.
import { onBeforeUnmount, ref, shallowRef, toRaw } from 'vue'
import type { PlanAnswer, PlanContext } from '#shared/physics/planner'
import { runPlanRequest, type PlanJob, type PlanResult } from '~~/utils/plannerRun'

export function usePlanner() {
  const answer = shallowRef<PlanAnswer | null>(null)
  const error = ref<string | null>(null)
  const issues = ref<PlanResult['issues']>([])
  const busy = ref(false)
  const elapsedMs = ref<number | null>(null)
  let seq = 0
  let worker: Worker | null = null
  let started = 0

  function done(r: PlanResult) {
    if (r.seq !== seq) return
    busy.value = false
    elapsedMs.value = performance.now() - started
    answer.value = r.answer
    error.value = r.error
    issues.value = r.issues
  }

  function ensureWorker(): Worker | null {
    if (worker || typeof Worker === 'undefined') return worker
    try {
      worker = new Worker(new URL('../components/editor/lib/planner.worker.ts', import.meta.url), { type: 'module' })
      worker.onmessage = (e: MessageEvent<PlanResult>) => done(e.data)
      worker.onerror = () => {
        worker = null
      }
    } catch {
      worker = null
    }
    return worker
  }

  /** Starts a plan; a newer call supersedes an older one still running. `lab`: the lab's library the request may name. */
  function plan(request: unknown, lab?: PlanContext['lab']) {
    seq++
    busy.value = true
    error.value = null
    started = performance.now()
    const job: PlanJob = {
      seq,
      request: JSON.parse(JSON.stringify(toRaw(request))),
      lab: lab ? JSON.parse(JSON.stringify(toRaw(lab))) : null,
    }
    const w = ensureWorker()
    if (w) w.postMessage(job)
    else setTimeout(() => done(runPlanRequest(job)), 0)
  }

  onBeforeUnmount(() => {
    worker?.terminate()
    worker = null
  })
  return { answer, error, issues, busy, elapsedMs, plan }
}
