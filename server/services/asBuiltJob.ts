// A large chip's as-built forecast as a background job (server/utils/jobs.ts): `recordAsBuilt` saves the report at
// once with a pending summary and queues "as-built.summary" in its transaction; any instance computes the as-built
// chip's summary (as the inline path does), writes it once and then queues the e-mail to the designer with what
// changed. While the drawn revision's own summary is still pending the job fails and is retried (back-off). When
// the retries are spent the report keeps a finished summary that says why there is no forecast, and the job is
// dead-lettered (listed on the lab's Jobs page).
import { and, eq, sql } from 'drizzle-orm'
import { asBuilts, revisions } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb } from '../utils/db'
import type { JobContext } from '../utils/jobs'
import type { ChipDocument } from '#shared/schemas/chip'
import type { RevisionSummary } from '#shared/types/designs'
import { asBuiltChanges } from '#shared/fabrication/asBuiltDiff'
import { queueAsBuiltMail, summarizeAsBuilt, type AsBuiltMailContext } from './asBuilt'
import { givenUpSummary } from './revisionSummary'

export type AsBuiltJobData = AsBuiltMailContext & { asBuiltId: string }

export async function asBuiltSummaryJob(data: AsBuiltJobData, job: JobContext) {
  const db = useDb()
  const [row] = await db
    .select({
      document: asBuilts.document,
      summary: asBuilts.summary,
      designed: revisions.summary,
      drawn: revisions.document,
    })
    .from(asBuilts)
    .innerJoin(revisions, eq(revisions.id, asBuilts.revisionId))
    .where(and(eq(asBuilts.id, data.asBuiltId), eq(asBuilts.labId, data.labId)))
  const stored = row?.summary as RevisionSummary | undefined
  if (!row || !stored?.pending) return { asBuiltId: data.asBuiltId, done: 'already' }
  const designed = row.designed as RevisionSummary
  const onlyPending = and(eq(asBuilts.id, data.asBuiltId), sql`${asBuilts.summary} ? 'pending'`)
  let summary: RevisionSummary
  try {
    if (designed.pending) throw new Error("the drawn revision's own forecast is still being computed")
    summary = await summarizeAsBuilt(row.document as unknown as ChipDocument, designed, data.labId)
  } catch (error) {
    if (job.retryCount >= job.retryLimit) {
      const summary = givenUpSummary(stored, 'as-built chip', error)
      await db
        .update(asBuilts)
        .set({ summary: summary as unknown as Record<string, unknown> })
        .where(onlyPending)
    }
    throw error
  }
  // The summary and the e-mail together: a retry after a crash finds the summary written and sends nothing twice.
  await db.transaction(async tx => {
    const [written] = await tx
      .update(asBuilts)
      .set({ summary: summary as unknown as Record<string, unknown> })
      .where(onlyPending)
      .returning({ id: asBuilts.id })
    if (written) await queueAsBuiltMail(tx, data, asBuiltChanges(designed, summary, row.drawn as never))
  })
  return { asBuiltId: data.asBuiltId, done: 'now', instance: useConfig().listen.port }
}
