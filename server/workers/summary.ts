// Worker thread: computes revision summaries (design rules + forecast) off the request thread.
// Bundled to .output/server/workers/summary.mjs by scripts/build-workers.mjs when Nitro has compiled.
import { parentPort } from 'node:worker_threads'
import type { ChipDocument } from '../../shared/schemas/chip'
import { summarizeRevision } from '../services/revisionSummary'

parentPort!.on('message', (job: { id: number, document: ChipDocument, processId: string }) => {
  try {
    parentPort!.postMessage({ id: job.id, summary: summarizeRevision(job.document, job.processId) })
  } catch (error) {
    parentPort!.postMessage({ id: job.id, error: error instanceof Error ? error.message : String(error) })
  }
})
