// The mail worker's rules, against an in-memory outbox and a stub transport: what is retried, when, how often,
// and that a failure is logged once and never thrown.
import { describe, expect, it } from 'vitest'
import type { MailMessage } from '../../server/db/schema'
import { deliverDue, mailConfigFromEnv, retryDelayMs, startMailWorker, type MailTransport, type OutboxStore } from '../../server/services/mailWorker'
import { outboxIdOf, outboxMessageId } from '../../server/services/mail'

const config = { ...mailConfigFromEnv({}), retryBaseMs: 5000, maxAttempts: 3 }

function memoryStore(rows: MailMessage[], clock = { now: 0 }): OutboxStore & { rows: MailMessage[] } {
  return {
    rows,
    async claimDue(limit, maxAttempts, leaseMs) {
      const due = rows.filter(r => !r.sentAt && r.nextAttemptAt.getTime() <= clock.now && r.attempts < maxAttempts).slice(0, limit)
      for (const r of due) r.nextAttemptAt = new Date(clock.now + leaseMs)
      return due.map(r => ({ ...r }))
    },
    async markSent(id) { rows.find(r => r.id === id)!.sentAt = new Date(clock.now) },
    async markFailed(id, attempts, error, retryInMs) {
      Object.assign(rows.find(r => r.id === id)!, { attempts, lastError: error, nextAttemptAt: new Date(clock.now + retryInMs) })
    },
  }
}

const row = (id: string): MailMessage => ({
  id, labId: null, kind: 'test', to: `${id}@test.example`, subject: 'Hello', text: 'Body', html: null,
  attempts: 0, nextAttemptAt: new Date(0), sentAt: null, lastError: null, createdAt: new Date(0),
})

/** Fails the first `failures` sends, then accepts; remembers what it was given. */
function stubTransport(failures: number): MailTransport & { sent: string[], calls: number } {
  const t = {
    sent: [] as string[], calls: 0,
    async send(mail: { to: string, messageId: string }) {
      t.calls++
      if (t.calls <= failures) throw new Error('connect ECONNREFUSED 127.0.0.1:1')
      t.sent.push(`${mail.to} ${mail.messageId}`)
    },
  }
  return t
}

describe('mail worker', () => {
  it('backs off exponentially from the base delay (common practice; 5 s, 10 s, 20 s by default)', () => {
    expect([1, 2, 3, 4].map(n => retryDelayMs(n, { retryBaseMs: 5000 }))).toEqual([5000, 10_000, 20_000, 40_000])
    expect(mailConfigFromEnv({})).toMatchObject({ pollMs: 1000, retryBaseMs: 5000, maxAttempts: 8, from: 'Dropwright <no-reply@dropwright.local>' })
    expect(mailConfigFromEnv({ DW_MAIL_POLL_MS: 'soon', MAIL_FROM: 'Lab <lab@x.example>' })).toMatchObject({ pollMs: 1000, from: 'Lab <lab@x.example>' })
  })

  it('records a failed send, logs one line, and sends on the next due round', async () => {
    const clock = { now: 0 }
    const store = memoryStore([row('a')], clock)
    const transport = stubTransport(1)
    const log: string[] = []
    expect(await deliverDue(store, transport, config, l => log.push(l))).toEqual({ sent: 0, failed: 1, claimed: 1 })
    expect(store.rows[0]).toMatchObject({ attempts: 1, lastError: 'connect ECONNREFUSED 127.0.0.1:1', sentAt: null })
    expect(store.rows[0]!.nextAttemptAt.getTime()).toBe(5000)
    expect(log).toHaveLength(1)
    expect(log[0]).toMatch(/^\[mail\] could not send test mail a to a@test\.example \(attempt 1 of 3\): connect ECONNREFUSED.*next try in 5 s$/)
    // Not due yet: nothing happens.
    clock.now = 4999
    expect(await deliverDue(store, transport, config, l => log.push(l))).toEqual({ sent: 0, failed: 0, claimed: 0 })
    clock.now = 5000
    expect(await deliverDue(store, transport, config, l => log.push(l))).toEqual({ sent: 1, failed: 0, claimed: 1 })
    expect(store.rows[0]!.sentAt).not.toBeNull()
    expect(transport.sent).toEqual([`a@test.example ${outboxMessageId('a')}`])
  })

  it('gives up after the maximum number of attempts and keeps the last error', async () => {
    const clock = { now: 0 }
    const store = memoryStore([row('b')], clock)
    const log: string[] = []
    for (let i = 0; i < 5; i++) {
      await deliverDue(store, stubTransport(99), config, l => log.push(l))
      clock.now += 60_000
    }
    expect(store.rows[0]).toMatchObject({ attempts: 3, sentAt: null, lastError: expect.stringContaining('ECONNREFUSED') })
    expect(log).toHaveLength(3)
    expect(log[2]).toMatch(/attempt 3 of 3.*giving up$/)
  })

  it('sends soon after a kick and stops cleanly', async () => {
    const store = memoryStore([row('c')], { now: Number.MAX_SAFE_INTEGER })
    const transport = stubTransport(0)
    const worker = startMailWorker(store, transport, { ...config, pollMs: 60_000 }, () => {})
    worker.kick()
    await expect.poll(() => transport.sent.length, { timeout: 2000 }).toBe(1)
    await worker.stop()
  })

  it('matches a kept message to its outbox row by Message-ID', () => {
    const id = '3f2a0c1e-9b7d-4e61-8a55-0d2c4b6e7f10'
    expect(outboxIdOf(outboxMessageId(id))).toBe(id)
    expect(outboxIdOf('<abc@example.com>')).toBeNull()
    expect(outboxIdOf(null)).toBeNull()
  })
})
