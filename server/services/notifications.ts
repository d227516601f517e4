// Notification e-mails for the review flow, queued in the caller's transaction (pass `tx`) so a message exists
// exactly when the change it reports was committed. `link` is an absolute address (see `appOrigin`).
import { queueMail, type DbOrTx } from './mail'
import { newCommentMail, releasedMail, reviewRequestedMail, verdictMail } from './mailTemplates'

interface Base { labId: string, to: string, designName: string, revisionNumber: number, link: string }

export const mailReviewRequested = (db: DbOrTx, p: Base & { requesterName: string }) =>
  queueMail(db, { labId: p.labId, kind: 'review-requested', to: p.to, ...reviewRequestedMail(p) })

export const mailNewComment = (db: DbOrTx, p: Base & { commenterName: string, excerpt: string }) =>
  queueMail(db, { labId: p.labId, kind: 'new-comment', to: p.to, ...newCommentMail(p) })

export const mailVerdict = (db: DbOrTx, p: Base & { reviewerName: string, verdict: 'approve' | 'request-changes', note?: string }) =>
  queueMail(db, { labId: p.labId, kind: 'verdict', to: p.to, ...verdictMail(p) })

export const mailReleased = (db: DbOrTx, p: Base & { releasedByName: string, labName: string }) =>
  queueMail(db, { labId: p.labId, kind: 'released', to: p.to, ...releasedMail(p) })
