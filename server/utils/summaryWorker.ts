// Revision summaries (rules + forecast, a few ms of CPU each) run in a worker thread when the built worker is
// present (.output/server/workers/summary.mjs), so a save does not hold up other requests. Without it (tests of
// the source, `nuxt dev` before its first build) they run in-thread. DW_SUMMARY_WORKER=0 turns the worker off.
import { existsSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { Worker } from 'node:worker_threads'
import type { ChipDocument } from '../../shared/schemas/chip'
import type { RevisionSummary } from '../../shared/types/designs'
import { summarizeRevision } from '../services/revisionSummary'

type Pending = { resolve: (s: RevisionSummary) => void, reject: (e: Error) => void }
let worker: Worker | null | undefined
let nextId = 1
const pending = new Map<number, Pending>()

function workerFile(): string | null {
  let dir = dirname(fileURLToPath(import.meta.url))
  for (let i = 0; i < 5; i++, dir = dirname(dir)) {
    const file = join(dir, 'workers', 'summary.mjs')
    if (existsSync(file)) return file
  }
  return null
}

function start(): Worker | null {
  const file = process.env.DW_SUMMARY_WORKER === '0' ? null : workerFile()
  if (!file) return null
  const w = new Worker(file)
  w.unref()
  w.on('message', (m: { id: number, summary?: RevisionSummary, error?: string }) => {
    const job = pending.get(m.id)
    pending.delete(m.id)
    if (m.summary) job?.resolve(m.summary)
    else job?.reject(new Error(m.error))
  })
  const fail = (error: Error) => {
    console.error('[summary-worker] stopped; it restarts on the next save:', error.message)
    for (const job of pending.values()) job.reject(error)
    pending.clear()
    worker = undefined
  }
  w.on('error', fail)
  w.on('exit', code => fail(new Error(`worker exited with code ${code}`)))
  return w
}

export function summaryWorkerRunning(): boolean {
  if (worker === undefined) worker = start()
  return worker !== null
}

export function summarizeOffThread(document: ChipDocument, processId: string): Promise<RevisionSummary> {
  if (!summaryWorkerRunning()) return Promise.resolve(summarizeRevision(document, processId))
  return new Promise((resolve, reject) => {
    const id = nextId++
    pending.set(id, { resolve, reject })
    worker!.postMessage({ id, document, processId })
  })
}
