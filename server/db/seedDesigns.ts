// Seeds the demo lab's designs with a history every role can look at: revisions, open and resolved comments,
// verdicts, an approved and a released revision. Skips a design that already exists (idempotent).
import { and, eq } from 'drizzle-orm'
import { requireChipDocument } from '../../shared/schemas/chip'
import { summarizeRevision } from '../services/revisionSummary'
import type { Db } from '../utils/db'
import { demoDesigns } from './demo-designs'
import type { RevisionStatus } from '../../shared/utils/revisionStatus'
import { activity, comments, commentThreads, designs, releases, reviewRequests, revisions, verdicts } from './schema'

type People = Record<'admin' | 'designer' | 'reviewer' | 'experimenter', string>
type Status = RevisionStatus

// Per design, the status of each revision, oldest first.
const HISTORY: Status[][] = [
  ['changes-requested', 'approved', 'released'],
  ['changes-requested', 'approved'],
  ['in-review'],
]

export async function seedDemoDesigns(db: Db, labId: string, people: People) {
  for (const [i, demo] of demoDesigns().entries()) {
    const [existing] = await db
      .select({ id: designs.id })
      .from(designs)
      .where(and(eq(designs.labId, labId), eq(designs.name, demo.name)))
    if (existing) continue
    await db.transaction(async tx => {
      const [design] = await tx
        .insert(designs)
        .values({ labId, name: demo.name, description: demo.description, createdBy: people.designer })
        .returning()
      let parentId: string | null = null
      for (const [n, rev] of demo.revisions.entries()) {
        const document = requireChipDocument(rev.document)
        const status = HISTORY[i]![n]!
        const [row]: Array<{ id: string }> = await tx
          .insert(revisions)
          .values({
            designId: design!.id,
            labId,
            number: n + 1,
            parentId,
            authorId: people.designer,
            message: rev.message,
            document,
            summary: summarizeRevision(document, design!.processId),
            status,
            statusChangedBy: status === 'released' ? people.admin : status === 'draft' ? null : people.reviewer,
          })
          .returning()
        parentId = row!.id
        const log = (actorId: string, action: string) =>
          tx.insert(activity).values({ labId, designId: design!.id, revisionId: row!.id, actorId, action, detail: {} })
        await log(people.designer, n === 0 ? 'design.created' : 'revision.saved')
        await tx
          .insert(reviewRequests)
          .values({ revisionId: row!.id, reviewerId: people.reviewer, requestedBy: people.designer })
        await log(people.designer, 'review.requested')
        const anchor = document.components[0]?.position ?? { x: 0, y: 0 }
        const [thread] = await tx
          .insert(commentThreads)
          .values({
            revisionId: row!.id,
            designId: design!.id,
            labId,
            createdBy: people.reviewer,
            anchor: { x: anchor.x, y: anchor.y, elementId: document.components[0]?.id },
            ...(status === 'in-review' ? {} : { resolvedAt: new Date(), resolvedBy: people.designer }),
          })
          .returning()
        await tx.insert(comments).values({
          threadId: thread!.id,
          authorId: people.reviewer,
          createdAt: new Date(Date.now() - 60_000),
          body:
            status === 'in-review'
              ? 'Is the manifold wide enough for **even flow** across all nozzles?'
              : 'This junction: go **narrower** for smaller drops.',
        })
        await log(people.reviewer, 'comment.pinned')
        if (status === 'in-review') continue
        await tx
          .insert(comments)
          .values({ threadId: thread!.id, authorId: people.designer, body: 'Done in the next revision.' })
        await tx.insert(verdicts).values({
          revisionId: row!.id,
          reviewerId: people.reviewer,
          verdict: status === 'changes-requested' ? 'request-changes' : 'approve',
        })
        await log(people.reviewer, status === 'changes-requested' ? 'review.changes-requested' : 'review.approved')
        if (status === 'released') {
          await tx
            .insert(releases)
            .values({ revisionId: row!.id, labId, releasedBy: people.admin, note: 'Two wafers, 25 µm SU-8' })
          await log(people.admin, 'revision.released')
        }
      }
      const kinds = [
        ...new Set(
          requireChipDocument(demo.revisions.at(-1)!.document)
            .components.map(c => c.kind)
            .filter(k => k !== 'serpentine'),
        ),
      ].sort()
      await tx
        .update(designs)
        .set({ latestRevisionId: parentId, revisionCount: demo.revisions.length, junctionKinds: kinds })
        .where(eq(designs.id, design!.id))
    })
  }
}
