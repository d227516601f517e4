// Comment threads pinned to a point or an element of a revision. Bodies are stored as typed; the client renders
// them as sanitised Markdown. An archived design takes no new threads, replies or resolves (409 "restore it first").
import { and, eq } from 'drizzle-orm'
import { createError } from 'h3'
import { comments, commentThreads } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { logActivity } from './activity'
import { assertNotArchived, findVisibleRevision, holdOpenDesign } from './designGuards'
import { notifyComment } from './notifications'

export async function createThread(
  caller: LabCaller,
  revisionId: string,
  input: { anchor: { x: number; y: number; elementId?: string }; body: string },
) {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  assertNotArchived(revision)
  return db.transaction(async tx => {
    await holdOpenDesign(tx, revision.designId)
    const [thread] = await tx
      .insert(commentThreads)
      .values({
        revisionId,
        designId: revision.designId,
        labId: caller.lab.labId,
        anchor: input.anchor,
        createdBy: caller.userId,
      })
      .returning({ id: commentThreads.id })
    await tx.insert(comments).values({ threadId: thread!.id, authorId: caller.userId, body: input.body })
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: revision.designId,
      revisionId,
      actorId: caller.userId,
      action: 'comment.pinned',
      detail: { at: input.anchor },
    })
    await notifyComment(tx, caller, revision, input.body)
    return { threadId: thread!.id }
  })
}

async function findThread(caller: LabCaller, revisionId: string, threadId: string) {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  assertNotArchived(revision)
  const [thread] = await db
    .select()
    .from(commentThreads)
    .where(and(eq(commentThreads.id, threadId), eq(commentThreads.revisionId, revisionId)))
  if (!thread)
    throw createError({
      statusCode: 404,
      statusMessage: 'Not Found',
      message: 'No such comment thread on this revision',
    })
  return { db, revision, thread }
}

export async function reply(caller: LabCaller, revisionId: string, threadId: string, body: string) {
  const { db, revision } = await findThread(caller, revisionId, threadId)
  return db.transaction(async tx => {
    await holdOpenDesign(tx, revision.designId)
    const [comment] = await tx
      .insert(comments)
      .values({ threadId, authorId: caller.userId, body })
      .returning({ id: comments.id })
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: revision.designId,
      revisionId,
      actorId: caller.userId,
      action: 'comment.replied',
    })
    await notifyComment(tx, caller, revision, body)
    return { commentId: comment!.id }
  })
}

export async function setResolved(caller: LabCaller, revisionId: string, threadId: string, resolved: boolean) {
  const { db, revision } = await findThread(caller, revisionId, threadId)
  await db.transaction(async tx => {
    await holdOpenDesign(tx, revision.designId)
    await tx
      .update(commentThreads)
      .set(resolved ? { resolvedAt: new Date(), resolvedBy: caller.userId } : { resolvedAt: null, resolvedBy: null })
      .where(eq(commentThreads.id, threadId))
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: revision.designId,
      revisionId,
      actorId: caller.userId,
      action: resolved ? 'comment.resolved' : 'comment.reopened',
    })
  })
  return { ok: true }
}
