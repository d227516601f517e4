// Geometry worker (a tinypool thread): revision summaries (design rules + forecast), mask DXF files and the
// public forecast, off the request's event loop. Each export is one task kind; server/utils/summaryWorker.ts
// runs them with a time budget and terminates a worker that overruns it. Bundled to
// .output/server/workers/geometry.mjs by scripts/build-workers.mjs when Nitro has compiled.
import { setPriority } from 'node:os'
import { ForecastInputError, runForecast, type ForecastAnswer } from '#shared/physics/forecast'
import { runPlan, type PlanAnswer, type PlanContext } from '#shared/physics/planner'
import { mergeLibrary, type LabLiquidsData } from '#shared/physics/liquids'
import type { LabLibraryData } from '../services/libraries'
import type { ChipDocument } from '#shared/schemas/chip'
import type { RevisionSummary } from '#shared/types/designs'
import { maskFile, type MaskInput, type MaskResult } from '../services/mask'
import { summarizeRevision } from '../services/revisionSummary'
import { useConfig } from '../utils/config'
import { labelFont } from '../utils/labelFont'

// Below the request thread: on Linux a nice value is per thread, so on a busy machine the event loop that answers
// requests gets the CPU first and a long geometry task waits (DW_GEOMETRY_NICE, default 10; 0 keeps it equal).
try {
  setPriority(useConfig().geometry.nice)
} catch {
  /* not allowed here: run at the same priority */
}

// The mask DXF's label font, parsed as the thread starts rather than on its first DXF (~0.1 s once).
try {
  labelFont()
} catch {
  /* the DXF route reports it if the font cannot be read */
}

export function summary(job: {
  document: ChipDocument
  processId: string
  lab?: LabLibraryData | null
}): RevisionSummary {
  return summarizeRevision(job.document, job.processId, job.lab)
}

export function dxf(job: MaskInput): MaskResult {
  return maskFile(job)
}

/** A refusal of the request crosses the thread as data (class instances do not survive the copy). */
export type ForecastResult =
  { ok: true; answer: ForecastAnswer } | { ok: false; message: string; issues: ForecastInputError['issues'] }

/** The request and, when a lab was named, that lab's liquids and pairs (plain data, merged here). */
export function forecast(job: { request: unknown; lab?: LabLiquidsData | null }): ForecastResult {
  try {
    return { ok: true, answer: runForecast(job.request, job.lab ? mergeLibrary(job.lab) : undefined) }
  } catch (error) {
    if (error instanceof ForecastInputError) return { ok: false, message: error.message, issues: error.issues }
    throw error
  }
}

export type PlanResult =
  { ok: true; answer: PlanAnswer } | { ok: false; message: string; issues: ForecastInputError['issues'] }

/** POST /api/v1/plan: the planner's window scan (one forecast per point) with its refusals as data; `lab`: the caller's lab's library. */
export function plan(job: { request: unknown; lab?: PlanContext['lab'] }): PlanResult {
  try {
    return { ok: true, answer: runPlan(job.request, { lab: job.lab ?? null }) }
  } catch (error) {
    if (error instanceof ForecastInputError) return { ok: false, message: error.message, issues: error.issues }
    throw error
  }
}
