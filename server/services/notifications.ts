// Who hears about review events, by e-mail. Messages are queued in the caller's transaction (mail_outbox) and
// sent by the mail worker; a send never blocks or fails the request.
import { and, eq, inArray, ne } from 'drizzle-orm'
import { designs, mailOutbox, memberships, users, type Revision } from '../db/schema'
import type { Db } from '../utils/db'
import type { LabCaller } from '../utils/access'

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]

export function publicOrigin(): string {
  return (process.env.DW_PUBLIC_URL || `http://${process.env.HOST || '127.0.0.1'}:${process.env.PORT || 3000}`).replace(/\/$/, '')
}

const revisionLink = (labId: string, revisionId: string) => `${publicOrigin()}/labs/${labId}/revisions/${revisionId}`

async function designName(tx: Tx, designId: string) {
  return (await tx.select({ name: designs.name }).from(designs).where(eq(designs.id, designId)))[0]?.name ?? 'a design'
}

async function queue(tx: Tx, labId: string, kind: string, to: string[], subject: string, lines: string[]) {
  const unique = [...new Set(to)]
  if (!unique.length) return
  const text = `${lines.join('\n')}\n\n— Dropwright`
  await tx.insert(mailOutbox).values(unique.map(address => ({ labId, kind, to: address, subject, text })))
}

async function emailsOf(tx: Tx, ids: string[], except: string) {
  if (!ids.length) return []
  const rows = await tx.select({ email: users.email }).from(users).where(and(inArray(users.id, ids), ne(users.id, except)))
  return rows.map(r => r.email)
}

export async function notifyReviewRequested(tx: Tx, caller: LabCaller, revision: Revision, reviewerIds: string[]) {
  const name = await designName(tx, revision.designId)
  await queue(tx, caller.lab.labId, 'review-requested', await emailsOf(tx, reviewerIds, caller.userId),
    `Review requested: ${name} r${revision.number}`,
    [`You are asked to review ${name}, revision ${revision.number} ("${revision.message}"), in ${caller.lab.name}.`, '', `Open it: ${revisionLink(caller.lab.labId, revision.id)}`])
}

export async function notifyComment(tx: Tx, caller: LabCaller, revision: Revision, body: string) {
  const name = await designName(tx, revision.designId)
  const [design] = await tx.select({ createdBy: designs.createdBy }).from(designs).where(eq(designs.id, revision.designId))
  const excerpt = body.length > 400 ? `${body.slice(0, 400)}…` : body
  await queue(tx, caller.lab.labId, 'comment', await emailsOf(tx, [revision.authorId, design!.createdBy], caller.userId),
    `New comment on ${name} r${revision.number}`,
    [`A comment on ${name}, revision ${revision.number}:`, '', excerpt, '', `Reply: ${revisionLink(caller.lab.labId, revision.id)}`])
}

export async function notifyVerdict(tx: Tx, caller: LabCaller, revision: Revision, verdict: string, note: string) {
  const name = await designName(tx, revision.designId)
  const said = verdict === 'approve' ? 'approved' : 'asked for changes to'
  await queue(tx, caller.lab.labId, 'verdict', await emailsOf(tx, [revision.authorId], caller.userId),
    `${verdict === 'approve' ? 'Approved' : 'Changes requested'}: ${name} r${revision.number}`,
    [`A reviewer ${said} ${name}, revision ${revision.number}.`, ...(note ? ['', note] : []), '', `Open it: ${revisionLink(caller.lab.labId, revision.id)}`])
}

export async function notifyReleased(tx: Tx, caller: LabCaller, revision: Revision) {
  const name = await designName(tx, revision.designId)
  const fabricators = await tx.select({ userId: memberships.userId }).from(memberships)
    .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.role, 'fabricator')))
  await queue(tx, caller.lab.labId, 'released', await emailsOf(tx, fabricators.map(f => f.userId), caller.userId),
    `Released for fabrication: ${name} r${revision.number}`,
    [`${caller.lab.name} released ${name}, revision ${revision.number}, for fabrication.`, 'The mask (DXF) and the fab sheet are ready to download.', '', `Open it: ${revisionLink(caller.lab.labId, revision.id)}`])
}
