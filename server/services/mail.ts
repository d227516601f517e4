// Queueing e-mail. A message is a row in `mail_outbox`, written in the caller's transaction when it has one, so it
// exists exactly when the change it reports does. The worker (server/plugins/mailWorker.ts) sends it later: a slow
// or broken mail server never slows or fails the request that queued it.
import { mailOutbox } from '../db/schema'
import type { Db } from '../utils/db'

/** A database handle or a transaction opened on one. */
export type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0]

export const MAIL_KINDS = ['invitation', 'review-requested', 'new-comment', 'verdict', 'released', 'password-reset', 'test'] as const
export type MailKind = (typeof MAIL_KINDS)[number]

export interface MailContent { subject: string, text: string, html?: string | null }
export interface QueuedMail extends MailContent { labId?: string | null, kind: MailKind, to: string }

let onQueued: (() => void) | null = null

/** The worker registers here to be woken when a message is queued (it also polls, for other instances' rows). */
export function onMailQueued(listener: (() => void) | null) {
  onQueued = listener
}

/** Header fields must be one line: a name or design title with a line break must not add headers. */
const oneLine = (value: string, max: number) => value.replace(/[\r\n\t]+/g, ' ').trim().slice(0, max)

export async function queueMail(db: DbOrTx, mail: QueuedMail): Promise<string> {
  const [id] = await queueMailTo(db, [mail.to], mail)
  return id!
}

/** One message to each recipient, queued in a single statement. */
export async function queueMailTo(db: DbOrTx, recipients: string[], mail: Omit<QueuedMail, 'to'>): Promise<string[]> {
  if (!recipients.length) return []
  const rows = await db.insert(mailOutbox).values(recipients.map(to => ({
    labId: mail.labId ?? null,
    kind: mail.kind,
    to: oneLine(to, 254),
    subject: oneLine(mail.subject, 300),
    text: mail.text,
    html: mail.html ?? null,
  }))).returning({ id: mailOutbox.id })
  onQueued?.()
  return rows.map(r => r.id)
}

/** The Message-ID a queued row is sent with; the outbox page matches kept messages to rows by it. */
export const outboxMessageId = (id: string) => `<${id}@outbox.dropwright.local>`
export function outboxIdOf(messageId: string | null | undefined): string | null {
  const m = /^<?([0-9a-f-]{36})@outbox\.dropwright\.local>?$/i.exec(messageId ?? '')
  return m ? m[1]!.toLowerCase() : null
}
