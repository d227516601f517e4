// Notification e-mails for the review flow, queued in the caller's transaction (pass `tx`) so a message exists
// exactly when the change it reports was committed. `link` is an absolute address (see `appOrigin`).
import { and, eq, inArray } from 'drizzle-orm'
import { designs, memberships, users } from '../db/schema'
import type { RevisionHead as Revision } from './designGuards'
import type { Tx } from '../utils/db'
import { appOrigin } from '../utils/origin'
import type { LabCaller } from '../utils/access'
import { queueMailTo, type DbOrTx } from './mail'
import { newCommentMail, releasedMail, reviewRequestedMail, verdictMail } from './mailTemplates'

/** `to`: one address or several (each gets its own message, queued in one statement). */
interface Base {
  labId: string
  to: string | string[]
  designName: string
  revisionNumber: number
  link: string
}

export const mailReviewRequested = (db: DbOrTx, p: Base & { requesterName: string }) =>
  queueMailTo(db, [p.to].flat(), { labId: p.labId, kind: 'review-requested', ...reviewRequestedMail(p) })

export const mailNewComment = (db: DbOrTx, p: Base & { commenterName: string; excerpt: string }) =>
  queueMailTo(db, [p.to].flat(), { labId: p.labId, kind: 'new-comment', ...newCommentMail(p) })

export const mailVerdict = (
  db: DbOrTx,
  p: Base & { reviewerName: string; verdict: 'approve' | 'request-changes'; note?: string },
) => queueMailTo(db, [p.to].flat(), { labId: p.labId, kind: 'verdict', ...verdictMail(p) })

export const mailReleased = (db: DbOrTx, p: Base & { releasedByName: string; labName: string }) =>
  queueMailTo(db, [p.to].flat(), { labId: p.labId, kind: 'released', ...releasedMail(p) })

// Who hears about review events. Called by the review services inside their transaction.
// Links in mail: the one configured origin (server/utils/origin.ts), never the request's Host header.
const revisionLink = (labId: string, revisionId: string) => `${appOrigin()}/labs/${labId}/revisions/${revisionId}`

async function context(tx: Tx, caller: LabCaller, revision: Revision) {
  const [row] = await tx
    .select({ name: designs.name, createdBy: designs.createdBy })
    .from(designs)
    .where(eq(designs.id, revision.designId))
  const [me] = await tx.select({ name: users.name }).from(users).where(eq(users.id, caller.userId))
  return {
    labId: caller.lab.labId,
    designName: row?.name ?? 'a design',
    revisionNumber: revision.number,
    link: revisionLink(caller.lab.labId, revision.id),
    createdBy: row?.createdBy,
    actorName: me?.name ?? 'Someone',
  }
}

async function emailsOf(tx: Tx, ids: Array<string | undefined>, except: string) {
  const wanted = [...new Set(ids.filter((id): id is string => !!id && id !== except))]
  if (!wanted.length) return []
  return (await tx.select({ email: users.email }).from(users).where(inArray(users.id, wanted))).map(r => r.email)
}

export async function notifyReviewRequested(tx: Tx, caller: LabCaller, revision: Revision, reviewerIds: string[]) {
  const c = await context(tx, caller, revision)
  await mailReviewRequested(tx, {
    ...c,
    to: await emailsOf(tx, reviewerIds, caller.userId),
    requesterName: c.actorName,
  })
}

export async function notifyComment(tx: Tx, caller: LabCaller, revision: Revision, body: string) {
  const c = await context(tx, caller, revision)
  const excerpt = body.length > 400 ? `${body.slice(0, 400)}…` : body
  await mailNewComment(tx, {
    ...c,
    to: await emailsOf(tx, [revision.authorId, c.createdBy], caller.userId),
    commenterName: c.actorName,
    excerpt,
  })
}

export async function notifyVerdict(
  tx: Tx,
  caller: LabCaller,
  revision: Revision,
  verdict: 'approve' | 'request-changes',
  note: string,
) {
  const c = await context(tx, caller, revision)
  await mailVerdict(tx, {
    ...c,
    to: await emailsOf(tx, [revision.authorId], caller.userId),
    reviewerName: c.actorName,
    verdict,
    note,
  })
}

export async function notifyReleased(tx: Tx, caller: LabCaller, revision: Revision) {
  const c = await context(tx, caller, revision)
  const fabricators = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.role, 'fabricator')))
  await mailReleased(tx, {
    ...c,
    to: await emailsOf(
      tx,
      fabricators.map(f => f.userId),
      caller.userId,
    ),
    releasedByName: c.actorName,
    labName: caller.lab.name,
  })
}
