// Queueing e-mail. A message is a row in `mail_outbox` plus a "mail.send" job (server/services/mailJob.ts), both
// written in the caller's transaction when it has one, so they exist exactly when the change they report does.
// Whichever server instance is free sends it later: a slow or broken mail server never slows or fails the request.
import { mailOutbox } from '../db/schema'
import type { Db } from '../utils/db'
import { enqueueJob } from '../utils/jobs'

/** A database handle or a transaction opened on one. */
export type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0]

export const MAIL_KINDS = [
  'invitation',
  'review-requested',
  'new-comment',
  'verdict',
  'released',
  'password-reset',
  'test',
  'order',
  'as-built',
] as const
export type MailKind = (typeof MAIL_KINDS)[number]

export interface MailContent {
  subject: string
  text: string
  html?: string | null
}
export interface QueuedMail extends MailContent {
  labId?: string | null
  kind: MailKind
  to: string
}

/** The job that sends one outbox row. */
export const MAIL_SEND_JOB = 'mail.send'
export interface MailSendData {
  outboxId: string
  labId: string | null
}

/** Header fields must be one line: a name or design title with a line break must not add headers. */
const oneLine = (value: string, max: number) =>
  value
    .replace(/[\r\n\t]+/g, ' ')
    .trim()
    .slice(0, max)

export async function queueMail(db: DbOrTx, mail: QueuedMail): Promise<string> {
  const [id] = await queueMailTo(db, [mail.to], mail)
  return id!
}

/** One message to each recipient: the rows in one statement, then one job each, all on `db`'s connection. */
export async function queueMailTo(db: DbOrTx, recipients: string[], mail: Omit<QueuedMail, 'to'>): Promise<string[]> {
  if (!recipients.length) return []
  const rows = await db
    .insert(mailOutbox)
    .values(
      recipients.map(to => ({
        labId: mail.labId ?? null,
        kind: mail.kind,
        to: oneLine(to, 254),
        subject: oneLine(mail.subject, 300),
        text: mail.text,
        html: mail.html ?? null,
      })),
    )
    .returning({ id: mailOutbox.id })
  for (const row of rows) {
    await enqueueJob<MailSendData>(MAIL_SEND_JOB, { outboxId: row.id, labId: mail.labId ?? null }, { tx: db })
  }
  return rows.map(r => r.id)
}

/** The Message-ID a queued row is sent with; the outbox page matches kept messages to rows by it. */
export const outboxMessageId = (id: string) => `<${id}@outbox.dropwright.local>`
export function outboxIdOf(messageId: string | null | undefined): string | null {
  const m = /^<?([0-9a-f-]{36})@outbox\.dropwright\.local>?$/i.exec(messageId ?? '')
  return m ? m[1]!.toLowerCase() : null
}
