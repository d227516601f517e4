// As-built reports: what the fab (or the lab on receipt) measured, the as-built document made from it
// (shared/fabrication/asBuilt.ts), its forecast and rules beside the drawn chip's, and an e-mail to the designer.
import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import { createError } from 'h3'
import { ZodError } from 'zod'
import { asBuiltFiles, asBuilts, designs, revisions, users } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb, type Tx } from '../utils/db'
import { enqueueJob } from '../utils/jobs'
import type { LabCaller } from '../utils/access'
import { appOrigin } from '../utils/origin'
import { summarizeOffThread } from '../utils/summaryWorker'
import { logActivity } from './activity'
import { findVisibleRevision } from './designGuards'
import { labLibraryData, type LabLibraryData } from './libraries'
import { conflict } from './locks'
import { queueMailTo } from './mail'
import { asBuiltMail } from './mailTemplates'
import { applyAsBuilt, AsBuiltError, measurableWidths } from '#shared/fabrication/asBuilt'
import { asBuiltChanges, describeChange, type AsBuiltChange } from '#shared/fabrication/asBuiltDiff'
import { chipDocument, documentPieceCount, type ChipDocument } from '#shared/schemas/chip'
import type { AsBuiltCreate } from '#shared/schemas/asBuilt'
import type { RevisionSummary } from '#shared/types/designs'
import { can } from '#shared/utils/roles'
import { snapshotAsLabData } from '../../geometry/rules'
import { pendingSummary } from './revisionSummary'

export const AS_BUILT_JOB = 'as-built.summary'

/** The fab reports what it made; the lab may record it on receipt (who records bench measurements). */
export function assertMayRecord(caller: LabCaller): void {
  if (!can(caller.lab.role, 'fabrication:report') && !can(caller.lab.role, 'measurements:record')) {
    throw createError({
      statusCode: 403,
      statusMessage: 'Forbidden',
      message: `Your role (${caller.lab.role}) may not record as-built sizes here`,
    })
  }
}

async function releasedRevision(caller: LabCaller, revisionId: string) {
  const db = useDb()
  const head = await findVisibleRevision(db, caller, revisionId)
  const [row] = await db
    .select({
      document: revisions.document,
      summary: revisions.summary,
      processId: designs.processId,
      designName: designs.name,
      designCreator: designs.createdBy,
    })
    .from(revisions)
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .where(eq(revisions.id, revisionId))
  return {
    head,
    ...row!,
    document: chipDocument.parse(row!.document) as ChipDocument,
    summary: row!.summary as unknown as RevisionSummary,
  }
}

/**
 * The as-built chip checked as the drawn one was: with the process values stored with the revision (a lab's own
 * process too, as it was then) and the lab's liquids and pairs.
 */
async function asBuiltLab(designed: RevisionSummary, labId: string): Promise<LabLibraryData> {
  const lab = await labLibraryData(useDb(), labId)
  const stored = designed.library?.process ? snapshotAsLabData(designed.library.process) : null
  const processes = stored ? [stored, ...lab.processes.filter(p => p.id !== stored.id)] : lab.processes
  return { ...lab, processes }
}

export async function summarizeAsBuilt(
  built: ChipDocument,
  designed: RevisionSummary,
  labId: string,
): Promise<RevisionSummary> {
  return summarizeOffThread(built, designed.processId, await asBuiltLab(designed, labId))
}

/** Who hears of an as-built (the revision's author and the design's creator, not the one who recorded it). */
export interface AsBuiltMailContext {
  labId: string
  revisionId: string
  actorId: string
  authorId: string
  designCreator: string
  designName: string
  revisionNumber: number
}

/** The e-mail to the designer with what changed, queued in the caller's transaction. */
export async function queueAsBuiltMail(tx: Tx, m: AsBuiltMailContext, changes: AsBuiltChange[]): Promise<void> {
  const wanted = [...new Set([m.authorId, m.designCreator])].filter(u => u !== m.actorId)
  const to = wanted.length
    ? (await tx.select({ email: users.email }).from(users).where(inArray(users.id, wanted))).map(u => u.email)
    : []
  const [me] = await tx.select({ name: users.name }).from(users).where(eq(users.id, m.actorId))
  await queueMailTo(tx, to, {
    labId: m.labId,
    kind: 'as-built',
    ...asBuiltMail({
      designName: m.designName,
      revisionNumber: m.revisionNumber,
      actorName: me?.name ?? 'Someone',
      changes: changes.filter(c => c.what !== 'findings' || c.designed !== c.asBuilt).map(describeChange),
      warnings: changes.filter(c => c.exceeds).length,
      link: `${appOrigin()}/labs/${m.labId}/revisions/${m.revisionId}/as-built`,
    }),
  })
}

const invalid = (issues: Array<{ path: string; message: string }>) =>
  createError({
    statusCode: 400,
    statusMessage: 'Bad Request',
    data: { issues },
    message: `As-built is invalid: ${issues
      .slice(0, 5)
      .map(i => `${i.path}: ${i.message}`)
      .join('; ')}`,
  })

export async function recordAsBuilt(
  caller: LabCaller,
  revisionId: string,
  body: Required<Omit<AsBuiltCreate, 'note'>> & { note: string },
) {
  assertMayRecord(caller)
  const r = await releasedRevision(caller, revisionId)
  if (r.head.status !== 'released')
    throw conflict('Record the as-built of a released revision: this one has not been released to fabrication', {
      status: r.head.status,
    })
  let built: ChipDocument
  try {
    built = chipDocument.parse(applyAsBuilt(r.document, body))
  } catch (error) {
    if (error instanceof AsBuiltError) throw invalid([{ path: error.field, message: error.message }])
    // A measured size the chip's own limits refuse (a width that closes a gap, a depth beyond the process): say where.
    if (error instanceof ZodError)
      throw invalid(
        error.issues.map(i => ({ path: `document.${i.path.join('.')}`, message: `As built, ${i.message}` })),
      )
    throw error
  }
  // A large chip (or a drawn one still being summarized) is recorded at once; the as-built summary job fills in
  // its forecast and sends the e-mail (asBuiltJob.ts).
  const pending = r.summary.pending === true || documentPieceCount(built) > useConfig().geometry.summaryInlinePieces
  const summary = pending
    ? pendingSummary(built, r.summary.processId, await asBuiltLab(r.summary, caller.lab.labId))
    : await summarizeAsBuilt(built, r.summary, caller.lab.labId)
  const changes = pending ? [] : asBuiltChanges(r.summary, summary, r.document)
  const mail: AsBuiltMailContext = {
    labId: caller.lab.labId,
    revisionId,
    actorId: caller.userId,
    authorId: r.head.authorId,
    designCreator: r.designCreator,
    designName: r.designName,
    revisionNumber: r.head.number,
  }
  const id = await useDb().transaction(async tx => {
    const [row] = await tx
      .insert(asBuilts)
      .values({
        labId: caller.lab.labId,
        revisionId,
        depths: body.depths,
        widths: body.widths,
        note: body.note,
        document: built as unknown as Record<string, unknown>,
        summary: summary as unknown as Record<string, unknown>,
        recordedBy: caller.userId,
      })
      .returning({ id: asBuilts.id })
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: r.head.designId,
      revisionId,
      actorId: caller.userId,
      action: 'as-built.recorded',
      detail: { warnings: changes.filter(c => c.exceeds).length },
    })
    if (pending) await enqueueJob(AS_BUILT_JOB, { asBuiltId: row!.id, ...mail }, { tx, singletonKey: row!.id })
    else await queueAsBuiltMail(tx, mail, changes)
    return row!.id
  })
  return { asBuiltId: id, changes, pending }
}

const reportColumns = {
  id: asBuilts.id,
  createdAt: asBuilts.createdAt,
  recordedByName: users.name,
  depths: asBuilts.depths,
  widths: asBuilts.widths,
}
const ofRevision = (labId: string, revisionId: string) =>
  and(eq(asBuilts.revisionId, revisionId), eq(asBuilts.labId, labId))

/** The latest as-built of a revision (if any) beside the drawn chip, with what the fab may measure. */
export async function getAsBuilt(caller: LabCaller, revisionId: string) {
  const r = await releasedRevision(caller, revisionId)
  const db = useDb()
  const [latest] = await db
    .select({ ...reportColumns, note: asBuilts.note, summary: asBuilts.summary })
    .from(asBuilts)
    .innerJoin(users, eq(users.id, asBuilts.recordedBy))
    .where(ofRevision(caller.lab.labId, revisionId))
    .orderBy(desc(asBuilts.createdAt))
    .limit(1)
  const files = latest
    ? await db
        .select({
          id: asBuiltFiles.id,
          fileName: asBuiltFiles.fileName,
          contentType: asBuiltFiles.contentType,
          bytes: asBuiltFiles.bytes,
        })
        .from(asBuiltFiles)
        .where(eq(asBuiltFiles.asBuiltId, latest.id))
        .orderBy(asc(asBuiltFiles.createdAt))
    : []
  const summary = latest?.summary as unknown as RevisionSummary | undefined
  return {
    revision: { id: revisionId, number: r.head.number, status: r.head.status, designName: r.designName },
    layers: r.document.layers.map(l => ({ id: l.id, name: l.name, depthUm: l.depth })),
    document: r.document,
    measurable: measurableWidths(r.document),
    designed: r.summary,
    asBuilt:
      latest && summary
        ? {
            id: latest.id,
            depths: latest.depths,
            widths: latest.widths,
            note: latest.note,
            recordedBy: latest.recordedByName,
            createdAt: latest.createdAt.toISOString(),
            summary,
            pending: summary.pending === true,
            changes: summary.pending ? [] : asBuiltChanges(r.summary, summary, r.document),
            files,
          }
        : null,
  }
}

/** The latest as-built report of a revision (who, when, what was measured), without its chip document. */
export async function latestAsBuiltReport(labId: string, revisionId: string) {
  const [row] = await useDb()
    .select(reportColumns)
    .from(asBuilts)
    .innerJoin(users, eq(users.id, asBuilts.recordedBy))
    .where(ofRevision(labId, revisionId))
    .orderBy(desc(asBuilts.createdAt))
    .limit(1)
  return row ?? null
}

/** The latest as-built report with its chip document: bench runs forecast on that chip. */
export async function latestAsBuiltChip(labId: string, revisionId: string) {
  const [row] = await useDb()
    .select({ ...reportColumns, document: asBuilts.document })
    .from(asBuilts)
    .innerJoin(users, eq(users.id, asBuilts.recordedBy))
    .where(ofRevision(labId, revisionId))
    .orderBy(desc(asBuilts.createdAt))
    .limit(1)
  return row ?? null
}
