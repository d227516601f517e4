// Micrographs of a bench run: upload (bytes checked, stored in object storage with a thumbnail), automatic
// measurement in a worker with progress kept in the row, the user's exclusions, and the files back out.
import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { createError } from 'h3'
import { excludeDrops, type Measurement } from '#shared/imaging/measure'
import { benchMicrographs, benchRuns } from '../db/schema'
import type { LabCaller } from '../utils/access'
import { useDb } from '../utils/db'
import { enqueueJob } from '../utils/jobs'
import { logActivity } from './activity'
import { findRun, micrographJson, refreshRunFromMicrographs } from './bench'
import { runImaging } from './imagingPool'
import { notFound } from './designGuards'
import { getObject } from './storage'

export const MEASURE_JOB = 'micrograph.measure'

/**
 * Hands the upload to the imaging process, which parses the form, checks the file by its bytes and stores the
 * original, its browser view and its thumbnail; then queues the measurement as a background job in the same
 * transaction as the row, and waits up to `waitMs` for the result: a small image answers with its drops at once
 * (201), a large one answers 202 with the row, whose status and progress the page follows.
 */
export async function uploadMicrograph(
  caller: LabCaller,
  runId: string,
  upload: { bodyFile: string; contentType: string },
  waitMs = 25_000,
) {
  await findRun(caller, runId)
  const id = randomUUID()
  const stored = await runImaging('store', { labId: caller.lab.labId, micrographId: id, ...upload }, 60_000)
  const db = useDb()
  await db.transaction(async tx => {
    await tx.insert(benchMicrographs).values({
      id,
      labId: caller.lab.labId,
      runId,
      objectKey: stored.objectKey,
      thumbnailKey: stored.thumbnailKey,
      contentType: stored.contentType,
      bytes: stored.bytes,
      fileName: stored.fileName,
      width: stored.width,
      height: stored.height,
      umPerPx: stored.umPerPx,
      status: 'queued',
      progress: 0,
      createdBy: caller.userId,
    })
    await enqueueJob(MEASURE_JOB, { labId: caller.lab.labId, runId, micrographId: id, actorId: caller.userId }, { tx })
  })
  const deadline = Date.now() + waitMs
  for (;;) {
    const [row] = await db.select().from(benchMicrographs).where(eq(benchMicrographs.id, id))
    if (row!.status === 'failed')
      throw createError({
        statusCode: 422,
        statusMessage: 'Unprocessable Content',
        message: `The micrograph could not be measured: ${row!.error ?? 'unknown error'}`,
      })
    if (row!.status === 'done' || Date.now() > deadline) {
      const measurement = row!.measurement as Measurement | null
      return {
        pending: row!.status !== 'done',
        micrograph: micrographJson(row!),
        drops: measurement?.drops ?? [],
        summary: measurement?.summary ?? null,
        method: measurement?.method ?? null,
      }
    }
    await new Promise(resolve => setTimeout(resolve, 150))
  }
}

/** The job: the imaging process fetches the bytes from storage, decodes and measures them; the result is kept. Idempotent. */
export async function measureMicrographJob(data: {
  labId: string
  runId: string
  micrographId: string
  actorId: string
}) {
  const db = useDb()
  const [row] = await db
    .select()
    .from(benchMicrographs)
    .where(and(eq(benchMicrographs.id, data.micrographId), eq(benchMicrographs.labId, data.labId)))
  if (!row || row.status === 'done') return
  const progress = (fraction: number) =>
    db.update(benchMicrographs).set({ status: 'measuring', progress: fraction }).where(eq(benchMicrographs.id, row.id))
  try {
    await progress(0.1)
    const { measurement, ...image } = await runImaging('measure', { objectKey: row.objectKey, umPerPx: row.umPerPx })
    await db
      .update(benchMicrographs)
      .set({
        status: 'done',
        progress: 1,
        error: null,
        width: image.width,
        height: image.height,
        measurement: measurement as unknown as Record<string, unknown>,
      })
      .where(eq(benchMicrographs.id, row.id))
    await refreshRunFromMicrographs(row.runId)
    const [run] = await db
      .select({ designId: benchRuns.designId, revisionId: benchRuns.revisionId })
      .from(benchRuns)
      .where(eq(benchRuns.id, row.runId))
    if (run)
      await logActivity(db, {
        labId: data.labId,
        designId: run.designId,
        revisionId: run.revisionId,
        actorId: data.actorId,
        action: 'bench.micrograph',
        detail: { runId: row.runId, micrographId: row.id, detected: measurement.drops.length },
      })
  } catch (error) {
    const message = error instanceof Error ? error.message.slice(0, 500) : 'measurement failed'
    // A file that cannot be measured stays failed (no retry would help); anything else is retried by the queue.
    const final =
      (error as { statusCode?: number }).statusCode !== undefined && (error as { statusCode: number }).statusCode < 500
    await db
      .update(benchMicrographs)
      .set(final ? { status: 'failed', error: message } : { status: 'queued', error: message })
      .where(eq(benchMicrographs.id, row.id))
    if (!final) throw error
  }
}

async function findMicrograph(caller: LabCaller, runId: string, micrographId: string) {
  await findRun(caller, runId)
  const [row] = await useDb()
    .select()
    .from(benchMicrographs)
    .where(
      and(
        eq(benchMicrographs.id, micrographId),
        eq(benchMicrographs.runId, runId),
        eq(benchMicrographs.labId, caller.lab.labId),
      ),
    )
  if (!row) throw notFound('micrograph')
  return row
}

export async function getMicrograph(caller: LabCaller, runId: string, micrographId: string) {
  const row = await findMicrograph(caller, runId, micrographId)
  const measurement = row.measurement as Measurement | null
  return {
    micrograph: micrographJson(row),
    drops: measurement?.drops ?? [],
    summary: measurement?.summary ?? null,
    method: measurement?.method ?? null,
  }
}

export async function excludeDetections(caller: LabCaller, runId: string, micrographId: string, excluded: number[]) {
  const row = await findMicrograph(caller, runId, micrographId)
  const measurement = row.measurement as Measurement | null
  if (!measurement || row.status !== 'done')
    throw createError({
      statusCode: 409,
      statusMessage: 'Conflict',
      message: 'This micrograph is not measured yet: wait until its measurement is done',
    })
  const known = new Set(measurement.drops.map(d => d.id))
  const unknown = excluded.find(id => !known.has(id))
  if (unknown !== undefined)
    throw createError({
      statusCode: 400,
      statusMessage: 'Bad Request',
      message: `Body is invalid: excluded: drop ${unknown} is not one of the ${known.size} detected drops`,
    })
  const next = excludeDrops(measurement, excluded)
  const [updated] = await useDb()
    .update(benchMicrographs)
    .set({
      measurement: next as unknown as Record<string, unknown>,
      excluded: [...new Set(excluded)].sort((a, b) => a - b),
    })
    .where(eq(benchMicrographs.id, micrographId))
    .returning()
  await refreshRunFromMicrographs(runId)
  return { micrograph: micrographJson(updated!), drops: next.drops, summary: next.summary, method: next.method }
}

export async function micrographFile(
  caller: LabCaller,
  runId: string,
  micrographId: string,
  variant: 'original' | 'thumbnail' | 'view',
) {
  const row = await findMicrograph(caller, runId, micrographId)
  if (variant === 'thumbnail')
    return { bytes: await getObject(row.thumbnailKey!), contentType: 'image/jpeg', fileName: 'thumbnail.jpg' }
  if (variant === 'view') {
    const key = row.objectKey.replace(/original$/, 'view.png')
    return {
      bytes: await getObject(key),
      contentType: row.contentType === 'image/tiff' ? 'image/png' : row.contentType,
      fileName: row.fileName,
    }
  }
  return { bytes: await getObject(row.objectKey), contentType: row.contentType, fileName: row.fileName }
}
