// Micrographs of a bench run: upload (bytes checked, stored in object storage with a thumbnail), automatic
// measurement in a worker with progress kept in the row, the user's exclusions, and the files back out.
import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { createError } from 'h3'
import { excludeDrops, type Measurement } from '../../shared/imaging/measure'
import { benchMicrographs } from '../db/schema'
import type { LabCaller } from '../utils/access'
import { useDb } from '../utils/db'
import { logActivity } from './activity'
import { findRun, micrographJson, refreshRunFromMicrographs } from './bench'
import { decodeGrey, measureOffThread, sniffMicrograph, thumbnail, webImage } from './benchImages'
import { notFound } from './designGuards'
import { getObject, objectKey, putObject } from './storage'

export async function uploadMicrograph(caller: LabCaller, runId: string, file: { bytes: Uint8Array, fileName: string }, umPerPx: number) {
  const run = await findRun(caller, runId)
  const contentType = await sniffMicrograph(file.bytes, file.fileName)
  const image = await decodeGrey(file.bytes)
  const id = randomUUID()
  const key = objectKey(caller.lab.labId, 'micrographs', id, 'original')
  const thumbKey = objectKey(caller.lab.labId, 'micrographs', id, 'thumbnail.jpg')
  const viewKey = objectKey(caller.lab.labId, 'micrographs', id, 'view.png')
  await putObject(key, file.bytes, contentType)
  await putObject(thumbKey, await thumbnail(file.bytes), 'image/jpeg')
  await putObject(viewKey, contentType === 'image/tiff' ? await webImage(file.bytes) : file.bytes, contentType === 'image/tiff' ? 'image/png' : contentType)
  const db = useDb()
  await db.insert(benchMicrographs).values({
    id, labId: caller.lab.labId, runId, objectKey: key, thumbnailKey: thumbKey, contentType, bytes: file.bytes.byteLength,
    fileName: file.fileName.slice(0, 200), width: image.width, height: image.height, umPerPx, status: 'measuring', progress: 0.3, createdBy: caller.userId,
  })
  let measurement: Measurement
  try {
    measurement = await measureOffThread(image, umPerPx)
  } catch (error) {
    await db.update(benchMicrographs).set({ status: 'failed', error: error instanceof Error ? error.message.slice(0, 500) : 'measurement failed' }).where(eq(benchMicrographs.id, id))
    throw createError({ statusCode: 422, statusMessage: 'Unprocessable Content', message: `The micrograph could not be measured: ${error instanceof Error ? error.message : error}` })
  }
  const [row] = await db.update(benchMicrographs).set({ status: 'done', progress: 1, measurement: measurement as unknown as Record<string, unknown> })
    .where(eq(benchMicrographs.id, id)).returning()
  await refreshRunFromMicrographs(runId)
  await logActivity(db, { labId: caller.lab.labId, designId: run.designId, revisionId: run.revisionId, actorId: caller.userId, action: 'bench.micrograph', detail: { runId, micrographId: id, detected: measurement.drops.length } })
  return { micrograph: micrographJson(row!), drops: measurement.drops, summary: measurement.summary, method: measurement.method }
}

async function findMicrograph(caller: LabCaller, runId: string, micrographId: string) {
  await findRun(caller, runId)
  const [row] = await useDb().select().from(benchMicrographs)
    .where(and(eq(benchMicrographs.id, micrographId), eq(benchMicrographs.runId, runId), eq(benchMicrographs.labId, caller.lab.labId)))
  if (!row) throw notFound('micrograph')
  return row
}

export async function getMicrograph(caller: LabCaller, runId: string, micrographId: string) {
  const row = await findMicrograph(caller, runId, micrographId)
  const measurement = row.measurement as Measurement | null
  return { micrograph: micrographJson(row), drops: measurement?.drops ?? [], summary: measurement?.summary ?? null, method: measurement?.method ?? null }
}

export async function excludeDetections(caller: LabCaller, runId: string, micrographId: string, excluded: number[]) {
  const row = await findMicrograph(caller, runId, micrographId)
  const measurement = row.measurement as Measurement | null
  if (!measurement || row.status !== 'done') throw createError({ statusCode: 409, statusMessage: 'Conflict', message: 'This micrograph is not measured yet: wait until its measurement is done' })
  const known = new Set(measurement.drops.map(d => d.id))
  const unknown = excluded.find(id => !known.has(id))
  if (unknown !== undefined) throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: `Body is invalid: excluded: drop ${unknown} is not one of the ${known.size} detected drops` })
  const next = excludeDrops(measurement, excluded)
  const [updated] = await useDb().update(benchMicrographs).set({ measurement: next as unknown as Record<string, unknown>, excluded: [...new Set(excluded)].sort((a, b) => a - b) })
    .where(eq(benchMicrographs.id, micrographId)).returning()
  await refreshRunFromMicrographs(runId)
  return { micrograph: micrographJson(updated!), drops: next.drops, summary: next.summary, method: next.method }
}

export async function micrographFile(caller: LabCaller, runId: string, micrographId: string, variant: 'original' | 'thumbnail' | 'view') {
  const row = await findMicrograph(caller, runId, micrographId)
  if (variant === 'thumbnail') return { bytes: await getObject(row.thumbnailKey!), contentType: 'image/jpeg', fileName: 'thumbnail.jpg' }
  if (variant === 'view') {
    const key = row.objectKey.replace(/original$/, 'view.png')
    return { bytes: await getObject(key), contentType: row.contentType === 'image/tiff' ? 'image/png' : row.contentType, fileName: row.fileName }
  }
  return { bytes: await getObject(row.objectKey), contentType: row.contentType, fileName: row.fileName }
}
