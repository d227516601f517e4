// Sending queued e-mail as a background job ("mail.send", server/utils/jobs.ts). `queueMail` writes the message to
// mail_outbox and queues one job per message in the same transaction. The job sends the row over SMTP and marks
// it sent; a failed send counts the attempt on the row (the outbox page shows it) and throws, so pg-boss retries it
// with exponential back-off on whichever instance is free, and lists it among the lab's failed jobs once the
// attempts are spent.
import { eq, sql } from 'drizzle-orm'
import { createTransport } from 'nodemailer'
import { mailOutbox, type MailMessage } from '../db/schema'
import { useConfig, type Config } from '../utils/config'
import type { Db } from '../utils/db'
import { defineJob, type JobContext } from '../utils/jobs'
import { MAIL_SEND_JOB, outboxMessageId, type MailSendData } from './mail'

export interface MailJobConfig {
  retryDelaySeconds: number // first retry after about this long; each further one waits about twice as long
  maxAttempts: number // then give up: the row stays unsent with its last error, the job is listed as failed
  from: string
}

export function mailJobConfig(config: Config = useConfig()): MailJobConfig {
  return { retryDelaySeconds: config.mail.retrySeconds, maxAttempts: config.mail.maxAttempts, from: config.mail.from }
}

/**
 * About when the next try comes after `attempts` failed ones: pg-boss waits delay × 2^(n−1) × (1 + a random
 * fraction) (its failJobs plan, pg-boss 10), so between 5–10 s, 10–20 s, 20–40 s … by default. The outbox page
 * shows the earliest.
 */
export function retryDelaySeconds(attempts: number, config: Pick<MailJobConfig, 'retryDelaySeconds'>): number {
  return config.retryDelaySeconds * 2 ** Math.max(0, attempts - 1)
}

export interface OutgoingMail {
  from: string
  to: string
  subject: string
  text: string
  html?: string
  messageId: string
}
export interface MailTransport {
  send(mail: OutgoingMail): Promise<void>
}

/** Where the job reads and records a message (the database in the server; a memory store in unit tests). */
export interface OutboxStore {
  get(id: string): Promise<MailMessage | null>
  markSent(id: string): Promise<void>
  markFailed(id: string, attempts: number, error: string, retryInSeconds: number): Promise<void>
}

export function dbOutboxStore(db: Db): OutboxStore {
  return {
    async get(id) {
      const [row] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, id))
      return row ?? null
    },
    async markSent(id) {
      await db
        .update(mailOutbox)
        .set({ sentAt: sql`now()`, lastError: null })
        .where(eq(mailOutbox.id, id))
    },
    async markFailed(id, attempts, error, retryInSeconds) {
      await db
        .update(mailOutbox)
        .set({
          attempts,
          lastError: error.slice(0, 2000),
          nextAttemptAt: sql`now() + ${retryInSeconds} * interval '1 second'`,
        })
        .where(eq(mailOutbox.id, id))
    },
  }
}

export function smtpTransport(url: string): MailTransport {
  const transport = createTransport({ url, connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 })
  return {
    async send(mail) {
      await transport.sendMail({ ...mail, html: mail.html || undefined })
    },
  }
}

export type SendOutcome = 'sent' | 'already-sent' | 'gone'

/**
 * One run of the job: send the row unless it is gone or already sent (a run retried after a crash between the
 * send and the mark), then mark it. A failed send is recorded on the row, logged in one line and thrown again.
 */
export async function sendOutboxMessage(
  store: OutboxStore,
  transport: MailTransport,
  config: MailJobConfig,
  outboxId: string,
  log: (line: string) => void = console.warn,
): Promise<SendOutcome> {
  const row = await store.get(outboxId)
  if (!row) return 'gone'
  if (row.sentAt) return 'already-sent'
  try {
    await transport.send({
      from: config.from,
      to: row.to,
      subject: row.subject,
      text: row.text,
      html: row.html ?? undefined,
      messageId: outboxMessageId(row.id),
    })
  } catch (error) {
    const attempts = row.attempts + 1
    const message = error instanceof Error ? error.message : String(error)
    const delay = retryDelaySeconds(attempts, config)
    await store.markFailed(row.id, attempts, message, delay)
    const next = attempts >= config.maxAttempts ? 'giving up' : `next try in ${delay} s or a little later`
    log(
      `[mail] could not send ${row.kind} mail ${row.id} to ${row.to} (attempt ${attempts} of ${config.maxAttempts}): ${message.split('\n')[0]}; ${next}`,
    )
    throw error
  }
  await store.markSent(row.id)
  return 'sent'
}

/** Defines "mail.send" with its retries; the jobs plugin calls it once (it works here with SMTP_URL and DW_MAIL_WORKER not 0). */
export function defineMailJob(
  store: OutboxStore,
  transport: MailTransport,
  config: MailJobConfig = mailJobConfig(),
  { workHere = true } = {},
) {
  return defineJob<MailSendData>(
    MAIL_SEND_JOB,
    (data: MailSendData, _job: JobContext) => sendOutboxMessage(store, transport, config, data.outboxId),
    {
      retryLimit: config.maxAttempts - 1,
      retryDelay: config.retryDelaySeconds,
      retryBackoff: true,
      expireInSeconds: 120,
      workHere,
    },
  )
}
