// Revisions are immutable: a save always inserts a new one. Optimistic concurrency: a save whose parent is no
// longer the design's latest revision gets 409 with what changed since, unless it asks to branch.
import { and, asc, eq, gt } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, revisions, users } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { RevisionDetail, RevisionRow, RevisionSummary } from '../../shared/types/designs'
import type { revisionCreate } from '../../shared/schemas/designs'
import type { z } from 'zod'
import { logActivity } from './activity'
import { findDesign, findVisibleRevision, notFound } from './designGuards'
import { validDocument } from './documents'
import { summarizeRevision } from './revisionSummary'

const rowColumns = {
  id: revisions.id, designId: revisions.designId, number: revisions.number, parentId: revisions.parentId, message: revisions.message,
  authorName: users.name, createdAt: revisions.createdAt, status: revisions.status, statusChangedAt: revisions.statusChangedAt, summary: revisions.summary,
}

type RawRow = { createdAt: Date, statusChangedAt: Date, summary: unknown } & Omit<RevisionRow, 'createdAt' | 'statusChangedAt' | 'summary'>
const toRow = (r: RawRow): RevisionRow => ({ ...r, createdAt: r.createdAt.toISOString(), statusChangedAt: r.statusChangedAt.toISOString(), summary: r.summary as RevisionSummary })

export async function listRevisions(caller: LabCaller, designId: string): Promise<RevisionRow[]> {
  const db = useDb()
  await findDesign(db, caller, designId)
  const rows = await db.select(rowColumns).from(revisions).innerJoin(users, eq(users.id, revisions.authorId))
    .where(and(eq(revisions.designId, designId), eq(revisions.labId, caller.lab.labId))).orderBy(asc(revisions.number))
  return rows.map(toRow)
}

export async function getRevision(caller: LabCaller, revisionId: string): Promise<RevisionDetail> {
  const db = useDb()
  const visible = await findVisibleRevision(db, caller, revisionId)
  const [row] = await db.select({ ...rowColumns, document: revisions.document, designName: designs.name, latestRevisionId: designs.latestRevisionId })
    .from(revisions).innerJoin(users, eq(users.id, revisions.authorId)).innerJoin(designs, eq(designs.id, revisions.designId))
    .where(eq(revisions.id, visible.id))
  return { ...toRow(row!), designName: row!.designName, labId: caller.lab.labId, document: row!.document, latestRevisionId: row!.latestRevisionId }
}

export async function createRevision(caller: LabCaller, designId: string, body: z.infer<typeof revisionCreate>) {
  const db = useDb()
  const design = await findDesign(db, caller, designId)
  if (design.archivedAt) throw createError({ statusCode: 409, statusMessage: 'Conflict', message: 'This design is archived: restore it before saving' })
  const document = validDocument(body.document)
  const summary = summarizeRevision(document, design.processId)
  return db.transaction(async (tx) => {
    const [locked] = await tx.select().from(designs).where(eq(designs.id, designId)).for('update')
    const [parent] = await tx.select({ id: revisions.id, number: revisions.number }).from(revisions)
      .where(and(eq(revisions.id, body.parentId), eq(revisions.designId, designId)))
    if (!parent) throw notFound('parent revision for this design')
    if (!body.branch && locked!.latestRevisionId !== parent.id) {
      const since = await tx.select(rowColumns).from(revisions).innerJoin(users, eq(users.id, revisions.authorId))
        .where(and(eq(revisions.designId, designId), gt(revisions.number, parent.number))).orderBy(asc(revisions.number))
      throw createError({
        statusCode: 409, statusMessage: 'Conflict',
        message: `Revision ${parent.number} is no longer the latest: ${since.map(r => `r${r.number} by ${r.authorName} ("${r.message}")`).join(', ')} came after it. Reload, or save yours as a branch.`,
        data: { latestRevisionId: locked!.latestRevisionId, since: since.map(toRow) },
      })
    }
    const number = locked!.revisionCount + 1
    const [revision] = await tx.insert(revisions).values({
      designId, labId: caller.lab.labId, number, parentId: parent.id, authorId: caller.userId, message: body.message, document, summary,
    }).returning({ id: revisions.id })
    await tx.update(designs).set({ latestRevisionId: revision!.id, revisionCount: number, updatedAt: new Date(), junctionKinds: summary.junctionKinds }).where(eq(designs.id, designId))
    await logActivity(tx, { labId: caller.lab.labId, designId, revisionId: revision!.id, actorId: caller.userId, action: body.branch ? 'revision.branched' : 'revision.saved', detail: { number, parent: parent.number, message: body.message } })
    return { revisionId: revision!.id, number }
  })
}
