// A mask DXF made in the background (pg-boss job "mask.dxf"): `POST …/dxf-exports` takes the same options as
// `GET …/dxf` and answers at once with an export id; any instance makes the file in a geometry worker and keeps it
// in object storage under the lab's prefix; `GET …/dxf-exports/:id` says how far it is and `…/file` hands it out.
// The export is the job itself (its id, state and output): pg-boss keeps it, no table of our own. Access is the
// revision's (checked on every call: a fabricator sees only released revisions, another lab nothing).
import { and, eq, sql } from 'drizzle-orm'
import { createError } from 'h3'
import type { z } from 'zod'
import { designs, revisions } from '../db/schema'
import type { LabCaller } from '../utils/access'
import { useDb } from '../utils/db'
import { bossJobs, enqueueJob, errorOf, type JobContext } from '../utils/jobs'
import { dxfOffThread } from '../utils/summaryWorker'
import type { dxfQuery } from '#shared/schemas/designs'
import type { MaskExport } from '#shared/types/designs'
import { assertNotArchived, findVisibleRevision } from './designGuards'
import { getObject, objectKey, putObject } from './storage'

export const MASK_JOB = 'mask.dxf'

export interface MaskJobData {
  labId: string
  revisionId: string
  mirror: boolean
  text: 'outline' | 'font'
  layers?: string[]
}
interface MaskJobOutput {
  key: string
  filename: string
  bytes: number
}

/** The DXF options of `GET …/dxf`'s query, as the job takes them. */
export function maskOptions(query: z.infer<typeof dxfQuery>) {
  const layers = query.layers
    ?.split(',')
    .map(s => s.trim())
    .filter(Boolean)
  return { mirror: query.mirror === 'true', text: query.text, ...(layers?.length ? { layers } : {}) }
}

export async function startMaskExport(caller: LabCaller, revisionId: string, query: z.infer<typeof dxfQuery>) {
  assertNotArchived(await findVisibleRevision(useDb(), caller, revisionId))
  const data: MaskJobData = { labId: caller.lab.labId, revisionId, ...maskOptions(query) }
  const exportId = await enqueueJob(MASK_JOB, data)
  if (!exportId) throw new Error('the mask job was not queued')
  return maskExport(caller, revisionId, exportId)
}

const notFound = () => createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such mask export' })
const STATES: Record<string, MaskExport['status']> = {
  created: 'queued',
  retry: 'queued',
  active: 'making',
  completed: 'ready',
  failed: 'failed',
  cancelled: 'failed',
}

async function exportJob(caller: LabCaller, revisionId: string, exportId: string) {
  await findVisibleRevision(useDb(), caller, revisionId)
  const [job] = await useDb()
    .select({ state: bossJobs.state, output: bossJobs.output })
    .from(bossJobs)
    .where(
      and(
        eq(bossJobs.id, exportId),
        eq(bossJobs.name, MASK_JOB),
        eq(sql`${bossJobs.data}->>'labId'`, caller.lab.labId),
        eq(sql`${bossJobs.data}->>'revisionId'`, revisionId),
      ),
    )
  if (!job) throw notFound()
  return job
}

export async function maskExport(caller: LabCaller, revisionId: string, exportId: string): Promise<MaskExport> {
  const job = await exportJob(caller, revisionId, exportId)
  const status = STATES[job.state] ?? 'queued'
  const out = job.output as Partial<MaskJobOutput>
  const base = `/api/labs/${caller.lab.labId}/revisions/${revisionId}/dxf-exports/${exportId}`
  if (status === 'ready')
    return { exportId, status, filename: out.filename!, bytes: out.bytes!, fileUrl: `${base}/file` }
  if (status === 'failed') return { exportId, status, error: errorOf(job.output) }
  return { exportId, status }
}

export async function maskExportFile(caller: LabCaller, revisionId: string, exportId: string) {
  const job = await exportJob(caller, revisionId, exportId)
  if (job.state !== 'completed')
    throw createError({ statusCode: 409, statusMessage: 'Conflict', message: 'The mask is not ready yet' })
  const out = job.output as MaskJobOutput
  return { filename: out.filename, body: await getObject(out.key) }
}

export async function maskJob(data: MaskJobData, job: JobContext): Promise<MaskJobOutput> {
  const [row] = await useDb()
    .select({
      id: revisions.id,
      number: revisions.number,
      createdAt: revisions.createdAt,
      document: revisions.document,
      designName: designs.name,
    })
    .from(revisions)
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .where(and(eq(revisions.id, data.revisionId), eq(revisions.labId, data.labId)))
  if (!row) throw new Error('the revision no longer exists')
  const revision = { ...row, createdAt: row.createdAt.toISOString() } as never
  const { dxf, filename } = await dxfOffThread(revision, {
    mirror: data.mirror,
    text: data.text,
    ...(data.layers ? { layers: data.layers } : {}),
  })
  const body = new TextEncoder().encode(dxf)
  const key = objectKey(data.labId, 'masks', job.id, filename)
  await putObject(key, body, 'application/dxf')
  return { key, filename, bytes: body.byteLength }
}
