// Duplicate a design from any revision, into the same lab or another lab where the person may design.
// The new design records where it came from, as it read at that moment.
import { eq } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, labs, revisions, users, type DesignOrigin } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { SessionData } from '#shared/types/session'
import { can } from '#shared/utils/roles'
import type { RevisionSummary } from '#shared/types/designs'
import { logActivity } from './activity'
import { findVisibleRevision } from './designGuards'
import { queueSummaryIfPending } from './summaryJob'

export async function duplicateRevision(
  session: SessionData,
  source: LabCaller,
  revisionId: string,
  body: { targetLabId: string; name: string },
) {
  const target = session.memberships.find(m => m.labId === body.targetLabId)
  if (!target) throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such target lab' })
  if (!can(target.role, 'designs:edit'))
    throw createError({
      statusCode: 403,
      statusMessage: 'Forbidden',
      message: `Your role in ${target.name} (${target.role}) may not create designs there`,
    })
  const db = useDb()
  const revision = await findVisibleRevision(db, source, revisionId)
  const [content] = await db
    .select({ document: revisions.document, summary: revisions.summary })
    .from(revisions)
    .where(eq(revisions.id, revision.id))
  const [context] = await db
    .select({ designName: designs.name, processId: designs.processId, authorName: users.name, labName: labs.name })
    .from(designs)
    .innerJoin(users, eq(users.id, revision.authorId))
    .innerJoin(labs, eq(labs.id, designs.labId))
    .where(eq(designs.id, revision.designId))
  const origin: DesignOrigin = {
    revisionId: revision.id,
    designId: revision.designId,
    designName: context!.designName,
    revisionNumber: revision.number,
    authorName: context!.authorName,
    labName: context!.labName,
  }
  return db.transaction(async tx => {
    const [design] = await tx
      .insert(designs)
      .values({
        labId: target.labId,
        name: body.name,
        processId: context!.processId,
        createdBy: source.userId,
        revisionCount: 1,
        origin,
        junctionKinds: (content!.summary as { junctionKinds?: string[] }).junctionKinds ?? [],
      })
      .returning()
    const [copy] = await tx
      .insert(revisions)
      .values({
        designId: design!.id,
        labId: target.labId,
        number: 1,
        authorId: source.userId,
        message: `Duplicated from ${origin.designName} r${origin.revisionNumber}`,
        document: content!.document,
        summary: content!.summary,
      })
      .returning({ id: revisions.id })
    await tx.update(designs).set({ latestRevisionId: copy!.id }).where(eq(designs.id, design!.id))
    // A copy of a revision still being summarized gets its own job (the source's job fills only the source).
    await queueSummaryIfPending(tx, content!.summary as RevisionSummary, { labId: target.labId, revisionId: copy!.id })
    await logActivity(tx, {
      labId: target.labId,
      designId: design!.id,
      revisionId: copy!.id,
      actorId: source.userId,
      action: 'design.duplicated',
      detail: { ...origin },
    })
    await logActivity(tx, {
      labId: source.lab.labId,
      designId: revision.designId,
      revisionId: revision.id,
      actorId: source.userId,
      action: 'revision.duplicated',
      detail: { into: body.name, lab: target.name },
    })
    return { labId: target.labId, designId: design!.id, revisionId: copy!.id }
  })
}
