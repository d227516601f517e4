// Long geometry off the request's event loop: revision summaries (rules + forecast), mask DXF files and the
// public forecast run in a tinypool pool of worker threads (.output/server/workers/geometry.mjs, built by
// scripts/build-workers.mjs). Each task has a time budget counted from when a worker takes it; a task over
// budget is cancelled by terminating its worker (tinypool's AbortSignal), and the request answers 422 naming
// what was too large. A worker also has a heap cap, so one chip cannot take the server's memory. At most
// DW_GEOMETRY_THREADS tasks run at once; the next DW_GEOMETRY_QUEUE wait, beyond that (or after waiting a
// whole budget) the answer is 503 with Retry-After. Without the built worker (tests of the source, `nuxt dev`
// before its first build) the work runs in-thread. DW_SUMMARY_WORKER=0 turns the pool off.
import { createError } from 'h3'
import Tinypool from 'tinypool'
import { ForecastInputError, runForecast, type ForecastAnswer } from '#shared/physics/forecast'
import { documentPieceCount, shownLimit, type ChipDocument } from '#shared/schemas/chip'
import type { RevisionDetail, RevisionSummary } from '#shared/types/designs'
import { maskFile, type MaskInput, type MaskResult } from '../services/mask'
import { summarizeRevision } from '../services/revisionSummary'
import type { ForecastResult, PlanResult } from '../workers/geometry'
import { runPlan, type PlanAnswer, type PlanContext } from '#shared/physics/planner'
import { mergeLibrary, type LabLiquidsData } from '#shared/physics/liquids'
import type { LabLibraryData } from '../services/libraries'
import { useConfig } from './config'
import { assertJsonDepth } from './jsonDepth'
import { builtWorkerFile } from './workerFile'

const geometry = useConfig().geometry
/** Per-task time budget (ms), worker threads, waiting tasks, worker heap (MB). */
export const GEOMETRY_BUDGET_MS = geometry.budgetMs
const THREADS = geometry.threads
// 256 waiting tasks: a burst of saves (120 at once on one design in tests/api/save-race.test.ts) waits its turn
// instead of answering 503; each waiting task holds one validated document, bounded by the 8 MiB body limit.
const QUEUE = geometry.queue
const HEAP_MB = geometry.heapMb

let pool: Tinypool | null | undefined

function usePool(): Tinypool | null {
  if (pool !== undefined) return pool
  const filename = geometry.worker ? builtWorkerFile('geometry') : null
  pool = filename
    ? new Tinypool({
        filename,
        minThreads: 1,
        maxThreads: THREADS,
        idleTimeout: 60_000,
        resourceLimits: { maxOldGenerationSizeMb: HEAP_MB },
      })
    : null
  return pool
}

/** Whether the geometry workers run (`/api/health` reports it as `summaryWorker`). */
export function summaryWorkerRunning(): boolean {
  const p = usePool()
  return p !== null && p.threads.length > 0
}

// Slots: a task only goes to tinypool when a worker is free, so its budget counts its own work, not the wait.
let running = 0
const waiting: Array<() => void> = []

function busy(): never {
  throw createError({
    statusCode: 503,
    statusMessage: 'Service Unavailable',
    message: 'The geometry workers are busy with other chips: try again in a few seconds',
    data: { retryAfterSeconds: 5 },
  })
}

async function takeSlot(): Promise<void> {
  if (running < THREADS) {
    running++
    return
  }
  if (waiting.length >= QUEUE) busy()
  await new Promise<void>((resolve, reject) => {
    const go = () => {
      clearTimeout(timer)
      running++
      resolve()
    }
    const timer = setTimeout(() => {
      waiting.splice(waiting.indexOf(go), 1)
      reject(
        createError({
          statusCode: 503,
          statusMessage: 'Service Unavailable',
          message: 'The geometry workers stayed busy with other chips: try again in a few seconds',
          data: { retryAfterSeconds: 5 },
        }),
      )
    }, GEOMETRY_BUDGET_MS)
    waiting.push(go)
  })
}

function releaseSlot(): void {
  running--
  waiting.shift()?.()
}

/** What a task was doing and what was too large, for the refusal when it overruns. */
interface TaskLabel {
  doing: string
  tooLarge: string
}

async function runTask<T>(p: Tinypool, name: string, task: unknown, label: TaskLabel): Promise<T> {
  await takeSlot()
  const started = performance.now()
  try {
    return (await p.run(task, { name, signal: AbortSignal.timeout(GEOMETRY_BUDGET_MS) })) as T
  } catch (error) {
    const code = error as { code?: string; name?: string }
    const fix = 'split it into several designs or simplify it'
    const why = `${label.tooLarge}; ${fix}`
    if (code.name === 'AbortError') {
      throw createError({
        statusCode: 422,
        statusMessage: 'Unprocessable Content',
        message: `${label.doing} took longer than ${GEOMETRY_BUDGET_MS / 1000} s and was stopped: ${why}`,
      })
    }
    if (code.code === 'ERR_WORKER_OUT_OF_MEMORY') {
      throw createError({
        statusCode: 422,
        statusMessage: 'Unprocessable Content',
        message: `${label.doing} needed more than ${HEAP_MB} MB of memory and was stopped after ${((performance.now() - started) / 1000).toFixed(1)} s: ${why}`,
      })
    }
    throw error
  } finally {
    releaseSlot()
  }
}

const chipTooLarge = (doc: unknown): string => {
  try {
    return `the chip is too large (${shownLimit(documentPieceCount(doc as ChipDocument))} drawn pieces)`
  } catch {
    return 'the chip is too large'
  }
}

/** The summary stored beside a new revision (design rules + forecast). */
export function summarizeOffThread(
  document: ChipDocument,
  processId: string,
  lab?: LabLibraryData | null,
): Promise<RevisionSummary> {
  const p = usePool()
  if (!p) return Promise.resolve(summarizeRevision(document, processId, lab))
  return runTask(
    p,
    'summary',
    { document, processId, lab: lab ?? null },
    { doing: 'Checking this chip (design rules and forecast)', tooLarge: chipTooLarge(document) },
  )
}

/** The mask DXF of a revision; a geometry that cannot be exported is a 400 naming the elements. */
export async function dxfOffThread(
  revision: RevisionDetail,
  options: { mirror: boolean; text: 'outline' | 'font'; layers?: string[] },
): Promise<{ dxf: string; filename: string }> {
  const input: MaskInput = {
    document: revision.document,
    number: revision.number,
    createdAt: revision.createdAt,
    designName: revision.designName,
    ...options,
  }
  const p = usePool()
  const result = p
    ? await runTask<MaskResult>(p, 'dxf', input, {
        doing: 'Making the DXF of this revision',
        tooLarge: chipTooLarge(revision.document),
      })
    : maskFile(input)
  if (!result.ok) throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: result.message })
  return result
}

/** POST /api/v1/forecast: a junction, a network or a chip document; a bad request is a 400 naming each field. */
export async function forecastOffThread(request: unknown, lab?: LabLiquidsData | null): Promise<ForecastAnswer> {
  assertJsonDepth(request)
  const p = usePool()
  let result: ForecastResult
  if (p) {
    result = await runTask<ForecastResult>(
      p,
      'forecast',
      { request, lab: lab ?? null },
      { doing: 'The forecast', tooLarge: 'the request is too large' },
    )
  } else {
    try {
      result = { ok: true, answer: runForecast(request, lab ? mergeLibrary(lab) : undefined) }
    } catch (error) {
      if (!(error instanceof ForecastInputError)) throw error
      result = { ok: false, message: error.message, issues: error.issues }
    }
  }
  if (!result.ok)
    throw createError({
      statusCode: 400,
      statusMessage: 'Bad Request',
      message: result.message,
      data: { issues: result.issues },
    })
  return result.answer
}

/**
 * POST /api/v1/plan: a window scan of one junction or a chip's junction; a bad request is a 400 naming each field.
 * `lab`: the caller's lab's own liquids, pairs and processes (the route checked the caller belongs to it).
 */
export async function planOffThread(request: unknown, lab?: PlanContext['lab']): Promise<PlanAnswer> {
  assertJsonDepth(request)
  const p = usePool()
  let result: PlanResult
  if (p) {
    result = await runTask<PlanResult>(
      p,
      'plan',
      { request, lab: lab ?? null },
      { doing: 'The plan', tooLarge: 'the chip or the search grid is too large' },
    )
  } else {
    try {
      result = { ok: true, answer: runPlan(request, { lab: lab ?? null }) }
    } catch (error) {
      if (!(error instanceof ForecastInputError)) throw error
      result = { ok: false, message: error.message, issues: error.issues }
    }
  }
  if (!result.ok)
    throw createError({
      statusCode: 400,
      statusMessage: 'Bad Request',
      message: result.message,
      data: { issues: result.issues },
    })
  return result.answer
}
