// One planner run, the same in the Web Worker (components/editor/lib/planner.worker.ts) and, where there is no
// worker, in the page.
import { ForecastInputError } from '#shared/physics/forecast'
import { runPlan, type PlanAnswer, type PlanContext } from '#shared/physics/planner'

/** `lab`: the lab's own liquids, pairs and processes (GET /api/v1/liquids?lab= → labData), which the request may name. */
export interface PlanJob {
  request: unknown
  lab?: PlanContext['lab']
}
export interface PlanResult {
  answer: PlanAnswer | null
  error: string | null
  issues: { path: string; message: string }[]
}

export function runPlanRequest(job: PlanJob): PlanResult {
  try {
    return { answer: runPlan(job.request, { lab: job.lab ?? null }), error: null, issues: [] }
  } catch (error) {
    if (error instanceof ForecastInputError)
      return {
        answer: null,
        error: error.issues.map(i => `${i.path || 'request'}: ${i.message}`).join('; '),
        issues: error.issues,
      }
    return { answer: null, error: error instanceof Error ? error.message : String(error), issues: [] }
  }
}

/** A plan's target as the forms take it, in lab units. */
export interface PlannerTarget {
  diameterUm: number
  tolerancePct: number
  minRateHz: number | null
  cellsPerMl: number | null
  runMinutes: number | null
}
