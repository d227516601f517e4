// Everything a review page shows for one revision, in one read.
import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import {
  comments,
  commentThreads,
  fabOrders,
  memberships,
  releases,
  reviewRequests,
  users,
  verdicts,
} from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { ReviewState, ThreadView, VerdictView } from '#shared/types/designs'
import { can } from '#shared/utils/roles'
import { findVisibleRevision } from './designGuards'

export async function getReviewState(caller: LabCaller, revisionId: string): Promise<ReviewState> {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  // A fabrication partner sees a released revision's status and release, not the lab's internal review.
  const insider = can(caller.lab.role, 'designs:view')
  const changer = revision.statusChangedBy
    ? ((await db.select({ name: users.name }).from(users).where(eq(users.id, revision.statusChangedBy)))[0]?.name ??
      null)
    : null
  const requests = await db
    .select({ reviewerId: reviewRequests.reviewerId, name: users.name })
    .from(reviewRequests)
    .innerJoin(users, eq(users.id, reviewRequests.reviewerId))
    .where(eq(reviewRequests.revisionId, revisionId))
  const allVerdicts = await db
    .select({
      reviewerId: verdicts.reviewerId,
      reviewerName: users.name,
      verdict: verdicts.verdict,
      note: verdicts.note,
      at: verdicts.createdAt,
    })
    .from(verdicts)
    .innerJoin(users, eq(users.id, verdicts.reviewerId))
    .where(eq(verdicts.revisionId, revisionId))
    .orderBy(desc(verdicts.createdAt))
  const latest = new Map<string, VerdictView>()
  for (const v of allVerdicts) if (!latest.has(v.reviewerId)) latest.set(v.reviewerId, { ...v, at: v.at.toISOString() })
  const members = await db
    .select({ userId: users.id, name: users.name, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.labId, caller.lab.labId))
    .orderBy(users.name)
  const releasedBy = alias(users, 'released_by')
  const [release] = await db
    .select({
      releasedAt: releases.releasedAt,
      releasedBy: releasedBy.name,
      note: releases.note,
      orderId: fabOrders.id,
      orderNumber: fabOrders.number,
      orderStatus: fabOrders.status,
      orderStatusAt: fabOrders.statusAt,
    })
    .from(releases)
    .innerJoin(releasedBy, eq(releasedBy.id, releases.releasedBy))
    .innerJoin(fabOrders, eq(fabOrders.releaseId, releases.id))
    .where(eq(releases.revisionId, revisionId))
  return {
    status: revision.status,
    statusChangedAt: revision.statusChangedAt.toISOString(),
    statusChangedBy: changer,
    requests: insider ? requests : [],
    verdicts: insider ? [...latest.values()] : [],
    threads: insider ? await listThreads(revisionId) : [],
    reviewers: insider ? members.filter(m => can(m.role, 'review:verdict')) : [],
    release: release
      ? { ...release, releasedAt: release.releasedAt.toISOString(), orderStatusAt: release.orderStatusAt.toISOString() }
      : null,
  }
}

async function listThreads(revisionId: string): Promise<ThreadView[]> {
  const db = useDb()
  const resolver = alias(users, 'resolver')
  const creator = alias(users, 'creator')
  const threads = await db
    .select({ t: commentThreads, createdBy: creator.name, resolvedBy: resolver.name })
    .from(commentThreads)
    .innerJoin(creator, eq(creator.id, commentThreads.createdBy))
    .leftJoin(resolver, eq(resolver.id, commentThreads.resolvedBy))
    .where(eq(commentThreads.revisionId, revisionId))
    .orderBy(asc(commentThreads.createdAt))
  if (!threads.length) return []
  const rows = await db
    .select({
      id: comments.id,
      threadId: comments.threadId,
      authorName: users.name,
      body: comments.body,
      createdAt: comments.createdAt,
    })
    .from(comments)
    .innerJoin(users, eq(users.id, comments.authorId))
    .where(
      and(
        inArray(
          comments.threadId,
          threads.map(t => t.t.id),
        ),
      ),
    )
    .orderBy(asc(comments.createdAt))
  return threads.map(({ t, createdBy, resolvedBy }) => ({
    id: t.id,
    anchor: t.anchor,
    createdBy,
    createdAt: t.createdAt.toISOString(),
    resolvedAt: t.resolvedAt?.toISOString() ?? null,
    resolvedBy: resolvedBy ?? null,
    comments: rows
      .filter(c => c.threadId === t.id)
      .map(c => ({ id: c.id, authorName: c.authorName, body: c.body, createdAt: c.createdAt.toISOString() })),
  }))
}
