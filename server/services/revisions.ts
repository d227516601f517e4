// Revisions are immutable: a save always inserts a new one. Optimistic concurrency: a save whose parent is no
// longer the design's latest revision gets 409 with what changed since, unless it asks to branch.
import { and, asc, eq, gt, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { createError } from 'h3'
import { activity, designs, revisions, users } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { RevisionDetail, RevisionRow, RevisionSummary } from '#shared/types/designs'
import type { revisionCreate } from '#shared/schemas/designs'
import type { z } from 'zod'
import {
  archivedDesign,
  assertNotArchived,
  findDesign,
  findVisibleRevision,
  notFound,
  seenRevisionId,
} from './designGuards'
import { validDocument } from './documents'
import { summarizeWithLibrary } from './libraries'
import { queueSummaryIfPending } from './summaryJob'

const rowColumns = {
  id: revisions.id,
  designId: revisions.designId,
  number: revisions.number,
  parentId: revisions.parentId,
  message: revisions.message,
  authorName: users.name,
  createdAt: revisions.createdAt,
  status: revisions.status,
  statusChangedAt: revisions.statusChangedAt,
  summary: revisions.summary,
}

type RawRow = { createdAt: Date; statusChangedAt: Date; summary: unknown } & Omit<
  RevisionRow,
  'createdAt' | 'statusChangedAt' | 'summary'
>
const toRow = (r: RawRow): RevisionRow => ({
  ...r,
  createdAt: r.createdAt.toISOString(),
  statusChangedAt: r.statusChangedAt.toISOString(),
  summary: r.summary as RevisionSummary,
})

export async function listRevisions(caller: LabCaller, designId: string): Promise<RevisionRow[]> {
  const db = useDb()
  await findDesign(db, caller, designId)
  const rows = await db
    .select(rowColumns)
    .from(revisions)
    .innerJoin(users, eq(users.id, revisions.authorId))
    .where(and(eq(revisions.designId, designId), eq(revisions.labId, caller.lab.labId)))
    .orderBy(asc(revisions.number))
  return rows.map(toRow)
}

/** A revision with its document; `{ open: true }` (mask export) refuses one on an archived design. */
export async function getRevision(
  caller: LabCaller,
  revisionId: string,
  options: { open?: boolean } = {},
): Promise<RevisionDetail> {
  const db = useDb()
  const visible = await findVisibleRevision(db, caller, revisionId)
  if (options.open) assertNotArchived(visible)
  const parent = alias(revisions, 'parent')
  const latest = alias(revisions, 'latest')
  const [row] = await db
    .select({
      ...rowColumns,
      document: revisions.document,
      designName: designs.name,
      latestRevisionId: designs.latestRevisionId,
      parentStatus: parent.status,
      latestStatus: latest.status,
    })
    .from(revisions)
    .innerJoin(users, eq(users.id, revisions.authorId))
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .leftJoin(parent, eq(parent.id, revisions.parentId))
    .leftJoin(latest, eq(latest.id, designs.latestRevisionId))
    .where(eq(revisions.id, visible.id))
  const { parentStatus, latestStatus, designName, document, latestRevisionId, ...rest } = row!
  return {
    ...toRow(rest),
    parentId: seenRevisionId(caller, rest.parentId, parentStatus),
    designName,
    labId: caller.lab.labId,
    document,
    latestRevisionId: seenRevisionId(caller, latestRevisionId, latestStatus),
  }
}

export async function createRevision(caller: LabCaller, designId: string, body: z.infer<typeof revisionCreate>) {
  const design = await findDesign(useDb(), caller, designId)
  assertNotArchived(design)
  const document = validDocument(body.document)
  // A parent that is already not the latest never becomes it again: such a save ends in 409 below, so it skips the
  // summary (the expensive part) and leaves the geometry workers to saves that can win.
  const stale = !body.branch && design.latestRevisionId !== body.parentId
  const summary = stale
    ? null
    : await summarizeWithLibrary(document, design.processId, caller.lab.labId, { largeInBackground: true })
  // One connection from begin to commit (DEVELOPERS.md, "Database work"): the loser of a race reads what came
  // after its parent through `tx`, on the connection that holds the lock, never through a second checkout.
  return useDb().transaction(async tx => {
    // Lock the design row: concurrent saves on one design queue here, and the parent check below sees the truth.
    const parentNumber = tx
      .select({ number: revisions.number })
      .from(revisions)
      .where(and(eq(revisions.id, body.parentId), eq(revisions.designId, designs.id)))
    const [locked] = await tx
      .select({
        latest: designs.latestRevisionId,
        count: designs.revisionCount,
        archived: sql<boolean>`${designs.archivedAt} is not null`,
        parent: sql<number | null>`(${parentNumber})`,
      })
      .from(designs)
      .where(eq(designs.id, designId))
      .for('no key update')
      .prepare('dw_save_lock')
      .execute()
    if (!locked) throw notFound('design')
    if (locked.archived) throw archivedDesign()
    if (locked.parent === null) throw notFound('parent revision for this design')
    if (!body.branch && locked.latest !== body.parentId) {
      const since = (
        await tx
          .select(rowColumns)
          .from(revisions)
          .innerJoin(users, eq(users.id, revisions.authorId))
          .where(and(eq(revisions.designId, designId), gt(revisions.number, locked.parent)))
          .orderBy(asc(revisions.number))
      ).map(toRow)
      throw createError({
        statusCode: 409,
        statusMessage: 'Conflict',
        message: `Revision ${locked.parent} is no longer the latest: ${since.map(r => `r${r.number} by ${r.authorName} ("${r.message}")`).join(', ')} came after it. Reload, or save yours as a branch.`,
        data: { latestRevisionId: locked.latest, since },
      })
    }
    if (!summary) throw new Error('a save without a summary reached the insert') // unreachable: stale saves end in 409 above
    const number = locked.count + 1
    // One round trip for the busiest write: the revision, the design's head and the activity line together.
    const rev = tx.$with('rev').as(
      tx
        .insert(revisions)
        .values({
          designId,
          labId: caller.lab.labId,
          number,
          parentId: body.parentId,
          authorId: caller.userId,
          message: body.message,
          document,
          summary,
        })
        .returning({ id: revisions.id }),
    )
    const head = tx.$with('head').as(
      tx
        .update(designs)
        .set({
          latestRevisionId: sql`(select id from ${rev})`,
          revisionCount: number,
          updatedAt: sql`now()`,
          junctionKinds: summary.junctionKinds,
        })
        .where(eq(designs.id, designId))
        .returning({ id: designs.id }),
    )
    const [saved] = await tx
      .with(rev, head)
      .insert(activity)
      .values({
        labId: caller.lab.labId,
        designId,
        revisionId: sql`(select id from ${rev})`,
        actorId: caller.userId,
        action: body.branch ? 'revision.branched' : 'revision.saved',
        detail: { number, parent: locked.parent, message: body.message },
      })
      .returning({ revisionId: activity.revisionId })
      .prepare('dw_save_insert')
      .execute()
    await queueSummaryIfPending(tx, summary, { labId: caller.lab.labId, revisionId: saved!.revisionId! })
    return { revisionId: saved!.revisionId!, number }
  })
}
