// Sending queued e-mail: claim due rows with FOR UPDATE SKIP LOCKED (several server instances share the work and
// never send a row twice at once), send each over SMTP, then mark it sent — or count the failure, keep the error
// and try again later with exponential back-off, up to a maximum number of attempts.
import { and, eq, inArray, isNull, lt, lte, sql } from 'drizzle-orm'
import { createTransport } from 'nodemailer'
import { mailOutbox, type MailMessage } from '../db/schema'
import type { Db } from '../utils/db'
import { outboxMessageId } from './mail'

export interface MailWorkerConfig {
  pollMs: number // how often to look for due rows
  retryBaseMs: number // first retry after this long; each further one waits twice as long
  maxAttempts: number // then give up (the row stays, with its last error)
  batchSize: number // rows claimed per round
  leaseMs: number // a claimed row is not due again for this long, so a crashed instance's rows come back
  from: string
}

export function mailConfigFromEnv(env: NodeJS.ProcessEnv = process.env): MailWorkerConfig {
  const num = (name: string, fallback: number) => {
    const n = Number(env[name])
    return Number.isFinite(n) && n > 0 ? n : fallback
  }
  return {
    pollMs: num('DW_MAIL_POLL_MS', 1000),
    retryBaseMs: num('DW_MAIL_RETRY_BASE_MS', 5000),
    maxAttempts: num('DW_MAIL_MAX_ATTEMPTS', 8),
    batchSize: num('DW_MAIL_BATCH', 20),
    leaseMs: num('DW_MAIL_LEASE_MS', 120_000),
    from: env.MAIL_FROM || 'Dropwright <no-reply@dropwright.local>',
  }
}

/** Wait before the next try after `attempts` failed ones: base × 2^(attempts−1) (5 s, 10 s, 20 s … by default). */
export function retryDelayMs(attempts: number, config: Pick<MailWorkerConfig, 'retryBaseMs'>): number {
  return config.retryBaseMs * 2 ** Math.max(0, attempts - 1)
}

export interface OutboxStore {
  claimDue(limit: number, maxAttempts: number, leaseMs: number): Promise<MailMessage[]>
  markSent(id: string): Promise<void>
  markFailed(id: string, attempts: number, error: string, retryInMs: number): Promise<void>
}

export interface OutgoingMail { from: string, to: string, subject: string, text: string, html?: string, messageId: string }
export interface MailTransport { send(mail: OutgoingMail): Promise<void> }

export function dbOutboxStore(db: Db): OutboxStore {
  const msFromNow = (ms: number) => sql`now() + ${ms} * interval '1 millisecond'`
  return {
    claimDue: (limit, maxAttempts, leaseMs) => db.transaction(async (tx) => {
      const rows = await tx.select().from(mailOutbox)
        .where(and(isNull(mailOutbox.sentAt), lte(mailOutbox.nextAttemptAt, sql`now()`), lt(mailOutbox.attempts, maxAttempts)))
        .orderBy(mailOutbox.nextAttemptAt).limit(limit)
        .for('update', { skipLocked: true })
      if (rows.length) {
        await tx.update(mailOutbox).set({ nextAttemptAt: msFromNow(leaseMs) }).where(inArray(mailOutbox.id, rows.map(r => r.id)))
      }
      return rows
    }),
    async markSent(id) {
      await db.update(mailOutbox).set({ sentAt: sql`now()`, lastError: null }).where(eq(mailOutbox.id, id))
    },
    async markFailed(id, attempts, error, retryInMs) {
      await db.update(mailOutbox).set({ attempts, lastError: error.slice(0, 2000), nextAttemptAt: msFromNow(retryInMs) }).where(eq(mailOutbox.id, id))
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

export interface RoundResult { sent: number, failed: number, claimed: number }

/** One round: claim what is due, send it, record the outcome. Never throws for a failed send. */
export async function deliverDue(store: OutboxStore, transport: MailTransport, config: MailWorkerConfig, log: (line: string) => void = console.warn): Promise<RoundResult> {
  const rows = await store.claimDue(config.batchSize, config.maxAttempts, config.leaseMs)
  let sent = 0
  let failed = 0
  for (const row of rows) {
    try {
      await transport.send({ from: config.from, to: row.to, subject: row.subject, text: row.text, html: row.html ?? undefined, messageId: outboxMessageId(row.id) })
      await store.markSent(row.id)
      sent++
    } catch (error) {
      failed++
      const attempts = row.attempts + 1
      const message = error instanceof Error ? error.message : String(error)
      const delay = retryDelayMs(attempts, config)
      await store.markFailed(row.id, attempts, message, delay)
      const next = attempts >= config.maxAttempts ? 'giving up' : `next try in ${Math.round(delay / 1000)} s`
      log(`[mail] could not send ${row.kind} mail ${row.id} to ${row.to} (attempt ${attempts} of ${config.maxAttempts}): ${message.split('\n')[0]}; ${next}`)
    }
  }
  return { sent, failed, claimed: rows.length }
}

export interface MailWorker { kick(): void, stop(): Promise<void> }

/** Runs `deliverDue` every `pollMs`, soon after a kick, and again at once while rounds come back full. */
export function startMailWorker(store: OutboxStore, transport: MailTransport, config: MailWorkerConfig, log: (line: string) => void = console.warn): MailWorker {
  let timer: ReturnType<typeof setTimeout> | null = null
  let running: Promise<void> | null = null
  let stopped = false
  let kicked = false
  let lastProblem = ''

  const schedule = (ms: number) => {
    if (stopped) return
    if (timer) clearTimeout(timer)
    timer = setTimeout(round, ms)
    timer.unref?.()
  }

  function round() {
    timer = null
    if (running) { kicked = true; return }
    kicked = false
    running = deliverDue(store, transport, config, log).then((r) => {
      lastProblem = ''
      return r.claimed >= config.batchSize
    }, (error: unknown) => {
      // The database may be away for a moment: say so once, keep polling.
      const message = `[mail] worker round failed: ${error instanceof Error ? error.message : String(error)}`
      if (message !== lastProblem) log(message)
      lastProblem = message
      return false
    }).then((more) => {
      running = null
      schedule(more || kicked ? 0 : config.pollMs)
    })
  }

  schedule(config.pollMs)
  return {
    // A queued row may still be inside its caller's transaction: look a moment later, the poll catches the rest.
    kick: () => schedule(25),
    async stop() {
      stopped = true
      if (timer) clearTimeout(timer)
      await running
    },
  }
}
