// Review actions: request review, verdicts and the status they lead to. Status: draft → in-review →
// (changes-requested ⇄ approved) → released. Released revisions are final.
import { and, desc, eq, inArray } from 'drizzle-orm'
import { createError } from 'h3'
import { memberships, reviewRequests, revisions, verdicts } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { RevisionStatus } from '#shared/utils/revisionStatus'
import { can } from '#shared/utils/roles'
import { logActivity } from './activity'
import { archivedDesign, findVisibleRevision } from './designGuards'
import { conflict, lockRevision } from './locks'
import { notifyReviewRequested, notifyVerdict } from './notifications'

export async function requestReview(caller: LabCaller, revisionId: string, reviewerIds: string[]) {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  if (revision.status === 'released')
    throw conflict('A released revision is final: save a new revision to review changes')
  const eligible = await db
    .select({ userId: memberships.userId, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.labId, caller.lab.labId), inArray(memberships.userId, reviewerIds)))
  const ok = new Set(eligible.filter(m => can(m.role, 'review:verdict')).map(m => m.userId))
  const bad = reviewerIds.filter(id => !ok.has(id))
  if (bad.length)
    throw createError({
      statusCode: 400,
      statusMessage: 'Bad Request',
      message: 'Every reviewer must be a member of this lab who may approve',
      data: { issues: [{ path: 'reviewerIds', message: `not a reviewer here: ${bad.join(', ')}` }] },
    })
  await db.transaction(async tx => {
    // Re-read under the row lock: a release or verdict that committed meanwhile decides what happens here.
    const locked = await lockRevision(tx, caller, revisionId)
    if (locked.archived) throw archivedDesign()
    if (locked.status === 'released')
      throw conflict('A released revision is final: save a new revision to review changes')
    await tx
      .insert(reviewRequests)
      .values(reviewerIds.map(reviewerId => ({ revisionId, reviewerId, requestedBy: caller.userId })))
      .onConflictDoNothing()
    if (locked.status === 'draft') {
      await tx
        .update(revisions)
        .set({ status: 'in-review', statusChangedAt: new Date(), statusChangedBy: caller.userId })
        .where(eq(revisions.id, revisionId))
    }
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: revision.designId,
      revisionId,
      actorId: caller.userId,
      action: 'review.requested',
      detail: { reviewers: reviewerIds.length },
    })
    await notifyReviewRequested(tx, caller, revision, reviewerIds)
  })
  return { ok: true }
}

export async function giveVerdict(
  caller: LabCaller,
  revisionId: string,
  verdict: 'approve' | 'request-changes',
  note: string,
) {
  return useDb().transaction(async tx => {
    // The revision row lock orders verdicts and releases: each sees the status the other committed.
    const revision = await lockRevision(tx, caller, revisionId)
    if (revision.archived) throw archivedDesign()
    if (revision.status === 'draft') throw conflict('Nobody asked for a review of this revision yet')
    if (revision.status === 'released')
      throw conflict('This revision was released to fabrication meanwhile: a released revision is final', {
        status: 'released',
      })
    await tx.insert(verdicts).values({ revisionId, reviewerId: caller.userId, verdict, note })
    const all = await tx
      .select({ reviewerId: verdicts.reviewerId, verdict: verdicts.verdict })
      .from(verdicts)
      .where(eq(verdicts.revisionId, revisionId))
      .orderBy(desc(verdicts.createdAt))
    const latest = new Map<string, string>()
    for (const v of all) if (!latest.has(v.reviewerId)) latest.set(v.reviewerId, v.verdict)
    const status: RevisionStatus = [...latest.values()].includes('request-changes') ? 'changes-requested' : 'approved'
    await tx
      .update(revisions)
      .set({ status, statusChangedAt: new Date(), statusChangedBy: caller.userId })
      .where(eq(revisions.id, revisionId))
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: revision.designId,
      revisionId,
      actorId: caller.userId,
      action: verdict === 'approve' ? 'review.approved' : 'review.changes-requested',
      detail: { note },
    })
    await notifyVerdict(tx, caller, revision, verdict, note)
    return { status }
  })
}
