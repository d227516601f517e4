// Bench runs of a revision: measured droplet sizes (typed, CSV or micrographs) beside the forecast. Every query is
// scoped to the caller's lab; fabricators and other labs get 404 for runs and their files.
import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import { createError, type H3Event } from 'h3'
import { describeSample } from '#shared/physics/calibration/stats'
import type { benchRunCreate, BenchRunCreate } from '#shared/schemas/bench'
import { SIZE_UNITS } from '#shared/schemas/bench'
import { parseSizeColumn } from '#shared/schemas/benchCsv'
import { can, type Permission } from '#shared/utils/roles'
import type { z } from 'zod'
import { benchMicrographs, benchRuns, revisions, users } from '../db/schema'
import { requireLabPermission, type LabCaller } from '../utils/access'
import { useDb } from '../utils/db'
import { logActivity } from './activity'
import { latestAsBuiltReport } from './asBuilt'
import { benchChip, predictRun, type RunPrediction } from './benchForecast'
import { assertNotArchived, findVisibleRevision, notFound } from './designGuards'

/**
 * Bench results are design work: a member who may not open the lab's designs (a fabricator) learns nothing of them
 * (404, as for another lab); a member who may open them but not record gets 403 on writes.
 */
export function requireBenchCaller(event: H3Event, labId: string, permission: Permission = 'designs:view'): LabCaller {
  const caller = requireLabPermission(event, labId, 'lab:view')
  if (!can(caller.lab.role, 'designs:view')) throw notFound('bench run')
  if (!can(caller.lab.role, permission))
    throw createError({
      statusCode: 403,
      statusMessage: 'Forbidden',
      message: `Your role (${caller.lab.role}) may not record bench results`,
    })
  return caller
}

type RunRow = typeof benchRuns.$inferSelect

export function runJson(
  run: RunRow & { ranByName?: string | null },
  micrographs: (typeof benchMicrographs.$inferSelect)[] = [],
) {
  const predicted = run.predicted as RunPrediction | null
  const relativeError =
    predicted && run.meanUm !== null && run.quantity === 'diameter'
      ? (run.meanUm - predicted.diameterUm) / predicted.diameterUm
      : null
  return {
    id: run.id,
    revisionId: run.revisionId,
    designId: run.designId,
    operatingPointId: run.operatingPointId,
    junctionId: run.junctionId,
    conditions: run.conditions,
    asBuilt: run.asBuilt,
    quantity: run.quantity,
    source: run.source,
    count: run.count,
    meanUm: run.meanUm,
    sdUm: run.sdUm,
    cv: run.cv,
    frequencyHz: run.frequencyHz,
    predicted,
    relativeError,
    notes: run.notes,
    ranBy: run.ranBy,
    ranByName: run.ranByName ?? null,
    ranAt: run.ranAt.toISOString(),
    micrographs: micrographs.map(micrographJson),
  }
}

export function micrographJson(m: typeof benchMicrographs.$inferSelect) {
  const measurement = m.measurement as { drops?: unknown[]; summary?: unknown } | null
  return {
    id: m.id,
    runId: m.runId,
    fileName: m.fileName,
    contentType: m.contentType,
    bytes: m.bytes,
    width: m.width,
    height: m.height,
    umPerPx: m.umPerPx,
    status: m.status,
    progress: m.progress,
    error: m.error,
    excluded: m.excluded,
    detected: measurement?.drops?.length ?? 0,
    summary: measurement?.summary ?? null,
    createdAt: m.createdAt.toISOString(),
  }
}

export async function listBenchRuns(caller: LabCaller, revisionId: string) {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  const runs = await db
    .select({ run: benchRuns, ranByName: users.name })
    .from(benchRuns)
    .leftJoin(users, eq(users.id, benchRuns.ranBy))
    .where(and(eq(benchRuns.revisionId, revisionId), eq(benchRuns.labId, caller.lab.labId)))
    .orderBy(asc(benchRuns.ranAt))
  const micrographs = runs.length
    ? await db
        .select()
        .from(benchMicrographs)
        .where(
          and(
            eq(benchMicrographs.labId, caller.lab.labId),
            inArray(
              benchMicrographs.runId,
              runs.map(r => r.run.id),
            ),
          ),
        )
        .orderBy(asc(benchMicrographs.createdAt))
    : []
  const report = await latestAsBuiltReport(caller.lab.labId, revisionId)
  return {
    revision: { id: revision.id, designId: revision.designId, number: revision.number, status: revision.status },
    asBuilt: report
      ? {
          id: report.id,
          reportedAt: report.createdAt.toISOString(),
          recordedByName: report.recordedByName,
          depths: report.depths,
          widths: report.widths,
        }
      : null,
    runs: runs.map(({ run, ranByName }) =>
      runJson(
        { ...run, ranByName },
        micrographs.filter(m => m.runId === run.id),
      ),
    ),
  }
}

export async function findRun(caller: LabCaller, runId: string): Promise<RunRow> {
  const [run] = await useDb()
    .select()
    .from(benchRuns)
    .where(and(eq(benchRuns.id, runId), eq(benchRuns.labId, caller.lab.labId)))
  if (!run) throw notFound('bench run')
  return run
}

export async function getBenchRun(caller: LabCaller, runId: string) {
  const run = await findRun(caller, runId)
  const micrographs = await useDb()
    .select()
    .from(benchMicrographs)
    .where(eq(benchMicrographs.runId, runId))
    .orderBy(asc(benchMicrographs.createdAt))
  return runJson(run, micrographs)
}

const badBody = (message: string, issues: { path: string; message: string }[]) =>
  createError({ statusCode: 400, statusMessage: 'Bad Request', message, data: { issues } })

/** Sizes in µm from a typed list or a CSV (every bad row named; nothing imported on error). */
export function runValues(input: z.infer<typeof benchRunCreate>): number[] {
  if (input.source === 'typed') return (input.values ?? []).map(v => v * SIZE_UNITS[input.unit])
  if (input.source === 'csv' && input.csv) {
    const result = parseSizeColumn(input.csv.text, {
      column: input.csv.column,
      unit: input.csv.unit,
      header: input.csv.header,
    })
    if (!result.ok) {
      const issues = result.errors.map(e => ({ path: `csv.row.${e.row}`, message: `row ${e.row}: ${e.message}` }))
      throw badBody(
        `The CSV was not imported (${result.errors.length}${result.errors.length >= 50 ? '+' : ''} problem${result.errors.length === 1 ? '' : 's'}): ${issues
          .slice(0, 5)
          .map(i => i.message)
          .join('; ')}`,
        issues,
      )
    }
    return result.valuesUm
  }
  return []
}

const summaryColumns = (values: number[]) => {
  if (!values.length) return { count: 0, meanUm: null, sdUm: null, cv: null }
  const s = describeSample(values)
  return { count: s.count, meanUm: s.mean, sdUm: s.sd, cv: s.cv }
}

export async function createBenchRun(caller: LabCaller, revisionId: string, input: z.infer<typeof benchRunCreate>) {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  assertNotArchived(revision)
  const values = runValues(input)
  const [doc] = await db.select({ document: revisions.document }).from(revisions).where(eq(revisions.id, revisionId))
  const { document, chip } = await benchChip(caller.lab.labId, revisionId, doc!.document, input)
  const forecast = await predictRun(document, input.operatingPointId, input.junctionId, input.conditions)
  const predicted = forecast && { ...forecast, chip }
  const run = await db.transaction(async tx => {
    const [row] = await tx
      .insert(benchRuns)
      .values({
        labId: caller.lab.labId,
        designId: revision.designId,
        revisionId,
        operatingPointId: input.operatingPointId ?? null,
        junctionId: input.junctionId ?? predicted?.junctionId ?? null,
        conditions: input.conditions,
        asBuilt: input.asBuilt ?? null,
        quantity: input.quantity,
        source: input.source,
        valuesUm: values,
        ...summaryColumns(values),
        frequencyHz: input.frequencyHz ?? null,
        predicted: predicted as unknown as Record<string, unknown> | null,
        notes: input.notes,
        ranBy: caller.userId,
        ranAt: input.ranAt ? new Date(input.ranAt) : new Date(),
      })
      .returning()
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: revision.designId,
      revisionId,
      actorId: caller.userId,
      action: 'bench.recorded',
      detail: { runId: row!.id, source: input.source, count: values.length },
    })
    return row!
  })
  return runJson(run)
}

/** The run's sizes from its measured micrographs (accepted drops, the user's exclusions left out). */
export async function refreshRunFromMicrographs(runId: string): Promise<void> {
  const db = useDb()
  const rows = await db
    .select({ measurement: benchMicrographs.measurement })
    .from(benchMicrographs)
    .where(and(eq(benchMicrographs.runId, runId), eq(benchMicrographs.status, 'done')))
  const values = rows.flatMap(r =>
    ((r.measurement as { drops?: { accepted: boolean; diameterUm: number }[] } | null)?.drops ?? [])
      .filter(d => d.accepted)
      .map(d => d.diameterUm),
  )
  await db
    .update(benchRuns)
    .set({ valuesUm: values, ...summaryColumns(values) })
    .where(eq(benchRuns.id, runId))
}

export async function labRunsForCalibration(caller: LabCaller) {
  return useDb().select().from(benchRuns).where(eq(benchRuns.labId, caller.lab.labId)).orderBy(desc(benchRuns.ranAt))
}

export type { BenchRunCreate }
