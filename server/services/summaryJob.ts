// A large chip's forecast and rule check as a background job (server/utils/jobs.ts): the save answers at once with
// a pending summary (`pendingSummary`) and queues "revision.summary" in its own transaction; any instance takes
// the job, computes the summary in the geometry workers and writes it once (migration 0015 lets a pending summary
// change, and nothing else). A failed run is retried with back-off; when the retries are spent the revision keeps
// a finished summary that says why there is no forecast, and the job is listed among the lab's failed jobs.
import { and, eq, sql } from 'drizzle-orm'
import { designs, revisions } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb } from '../utils/db'
import { enqueueJob, type JobContext, type JobTransaction } from '../utils/jobs'
import { summarizeOffThread } from '../utils/summaryWorker'
import type { ChipDocument } from '#shared/schemas/chip'
import type { RevisionSummary } from '#shared/types/designs'
import { labLibraryData } from './libraries'
import { givenUpSummary } from './revisionSummary'

export const SUMMARY_JOB = 'revision.summary'

export interface SummaryJobData {
  labId: string
  revisionId: string
}

/** Queue the job for a revision saved with a pending summary, in the transaction that saves it. */
export async function queueSummaryIfPending(
  tx: JobTransaction,
  summary: RevisionSummary,
  data: SummaryJobData,
): Promise<void> {
  if (summary.pending) await enqueueJob(SUMMARY_JOB, data, { tx, singletonKey: data.revisionId })
}

export async function summaryJob(data: SummaryJobData, job: JobContext) {
  const db = useDb()
  const [row] = await db
    .select({ document: revisions.document, summary: revisions.summary, processId: designs.processId })
    .from(revisions)
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .where(and(eq(revisions.id, data.revisionId), eq(revisions.labId, data.labId)))
  const stored = row?.summary as RevisionSummary | undefined
  if (!row || !stored?.pending) return { revisionId: data.revisionId, done: 'already' }
  const lab = await labLibraryData(db, data.labId)
  const write = (summary: RevisionSummary) =>
    db
      .update(revisions)
      .set({ summary })
      .where(and(eq(revisions.id, data.revisionId), sql`${revisions.summary} ? 'pending'`))
  try {
    await write(await summarizeOffThread(row.document as ChipDocument, row.processId, lab))
  } catch (error) {
    if (job.retryCount >= job.retryLimit) {
      // Retries spent: a finished summary that says so, never one pending forever; the job still fails, so it is
      // copied to the dead-letter queue and listed for the lab's admins.
      await write(givenUpSummary(stored, 'revision', error))
    }
    throw error
  }
  return { revisionId: data.revisionId, done: 'now', instance: useConfig().listen.port }
}
