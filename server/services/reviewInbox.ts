// A person's lab overview: the lab's recent designs, the revisions waiting for their verdict and the open comment
// threads they took part in. Every query is scoped to the caller's lab; what a role may not see comes back empty
// (a fabricator sees released work only: their landing page is the releases list).
import { and, desc, eq, exists, isNull, notExists, sql } from 'drizzle-orm'
import { commentThreads, comments, designs, reviewRequests, revisions, users, verdicts } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { ReviewInbox } from '#shared/types/inbox'
import { can } from '#shared/utils/roles'

/** How many of each the overview lists (common practice, no source: a screenful). */
export const INBOX_LIMIT = 8

export async function reviewInbox(caller: LabCaller): Promise<ReviewInbox> {
  if (!can(caller.lab.role, 'designs:view')) return { recentDesigns: [], waitingForMe: [], myOpenThreads: [] }
  const db = useDb()
  const labId = caller.lab.labId
  const [recent, waiting, threads] = await Promise.all([
    db
      .select({
        designId: designs.id,
        name: designs.name,
        updatedAt: designs.updatedAt,
        latestNumber: revisions.number,
        status: revisions.status,
      })
      .from(designs)
      .leftJoin(revisions, eq(revisions.id, designs.latestRevisionId))
      .where(and(eq(designs.labId, labId), isNull(designs.archivedAt)))
      .orderBy(desc(designs.updatedAt), designs.id)
      .limit(INBOX_LIMIT),
    // Asked of me, still in review, and no verdict of mine since I was asked.
    db
      .select({
        revisionId: revisions.id,
        designId: designs.id,
        designName: designs.name,
        number: revisions.number,
        askedAt: reviewRequests.createdAt,
        authorName: users.name,
      })
      .from(reviewRequests)
      .innerJoin(revisions, eq(revisions.id, reviewRequests.revisionId))
      .innerJoin(designs, eq(designs.id, revisions.designId))
      .innerJoin(users, eq(users.id, revisions.authorId))
      .where(
        and(
          eq(reviewRequests.reviewerId, caller.userId),
          eq(revisions.labId, labId),
          eq(revisions.status, 'in-review'),
          isNull(designs.archivedAt),
          notExists(
            db
              .select({ one: sql`1` })
              .from(verdicts)
              .where(
                and(
                  eq(verdicts.revisionId, revisions.id),
                  eq(verdicts.reviewerId, caller.userId),
                  sql`${verdicts.createdAt} >= ${reviewRequests.createdAt}`,
                ),
              ),
          ),
        ),
      )
      .orderBy(desc(reviewRequests.createdAt))
      .limit(INBOX_LIMIT),
    // Open threads I wrote in.
    db
      .select({
        threadId: commentThreads.id,
        revisionId: revisions.id,
        designId: designs.id,
        designName: designs.name,
        number: revisions.number,
        createdAt: commentThreads.createdAt,
      })
      .from(commentThreads)
      .innerJoin(revisions, eq(revisions.id, commentThreads.revisionId))
      .innerJoin(designs, eq(designs.id, commentThreads.designId))
      .where(
        and(
          eq(commentThreads.labId, labId),
          isNull(commentThreads.resolvedAt),
          isNull(designs.archivedAt),
          exists(
            db
              .select({ one: sql`1` })
              .from(comments)
              .where(and(eq(comments.threadId, commentThreads.id), eq(comments.authorId, caller.userId))),
          ),
        ),
      )
      .orderBy(desc(commentThreads.createdAt))
      .limit(INBOX_LIMIT),
  ])
  return {
    recentDesigns: recent.map(r => ({
      ...r,
      updatedAt: r.updatedAt.toISOString(),
      latestNumber: r.latestNumber ?? null,
      status: r.status ?? null,
    })),
    waitingForMe: waiting.map(r => ({ ...r, askedAt: r.askedAt.toISOString() })),
    myOpenThreads: threads.map(r => ({ ...r, createdAt: r.createdAt.toISOString() })),
  }
}
