// The "mail.send" job's rules, against an in-memory outbox and a stub transport: what one run does with a row,
// what a failure records, and how long the next try waits. The retries themselves are pg-boss's
// (tests/api/mail.test.ts and tests/api/jobs.test.ts watch them on the real queue).
import { describe, expect, it } from 'vitest'
import type { MailMessage } from '../../server/db/schema'
import { loadConfig } from '../../server/utils/config'
import {
  mailJobConfig,
  retryDelaySeconds,
  sendOutboxMessage,
  type MailTransport,
  type OutboxStore,
} from '../../server/services/mailJob'
import { outboxIdOf, outboxMessageId } from '../../server/services/mail'

const config = { ...mailJobConfig(loadConfig({})), maxAttempts: 3 }

function memoryStore(rows: MailMessage[]): OutboxStore & { rows: MailMessage[] } {
  return {
    rows,
    async get(id) {
      const r = rows.find(x => x.id === id)
      return r ? { ...r } : null
    },
    async markSent(id) {
      rows.find(r => r.id === id)!.sentAt = new Date(1)
    },
    async markFailed(id, attempts, error, retryInSeconds) {
      Object.assign(
        rows.find(r => r.id === id)!,
        { attempts, lastError: error, nextAttemptAt: new Date(retryInSeconds * 1000) },
      )
    },
  }
}

const row = (id: string): MailMessage => ({
  id,
  labId: null,
  kind: 'test',
  to: `${id}@test.example`,
  subject: 'Hello',
  text: 'Body',
  html: null,
  attempts: 0,
  nextAttemptAt: new Date(0),
  sentAt: null,
  lastError: null,
  createdAt: new Date(0),
})

/** Fails the first `failures` sends, then accepts; remembers what it was given. */
function stubTransport(failures: number): MailTransport & { sent: string[]; calls: number } {
  const t = {
    sent: [] as string[],
    calls: 0,
    async send(mail: { to: string; messageId: string }) {
      t.calls++
      if (t.calls <= failures) throw new Error('connect ECONNREFUSED 127.0.0.1:1')
      t.sent.push(`${mail.to} ${mail.messageId}`)
    },
  }
  return t
}

describe('mail.send job', () => {
  it('takes its settings from the configuration', () => {
    expect(mailJobConfig(loadConfig({}))).toEqual({
      retryDelaySeconds: 5,
      maxAttempts: 8,
      from: 'Dropwright <no-reply@dropwright.local>',
    })
    expect(
      mailJobConfig(
        loadConfig({ DW_MAIL_RETRY_SECONDS: '2', DW_MAIL_MAX_ATTEMPTS: '3', MAIL_FROM: 'Lab <lab@x.example>' }),
      ),
    ).toEqual({ retryDelaySeconds: 2, maxAttempts: 3, from: 'Lab <lab@x.example>' })
  })

  it('shows the earliest next try: delay × 2^(n−1) (pg-boss 10 failJobs plan: delay·2^n/2 plus up to as much jitter)', () => {
    expect([1, 2, 3, 4].map(n => retryDelaySeconds(n, { retryDelaySeconds: 5 }))).toEqual([5, 10, 20, 40])
  })

  it('records a failed send on the row, logs one line and throws, so pg-boss retries it; the retry sends it', async () => {
    const store = memoryStore([row('a')])
    const transport = stubTransport(1)
    const log: string[] = []
    await expect(sendOutboxMessage(store, transport, config, 'a', l => log.push(l))).rejects.toThrow(/ECONNREFUSED/)
    expect(store.rows[0]).toMatchObject({ attempts: 1, lastError: 'connect ECONNREFUSED 127.0.0.1:1', sentAt: null })
    expect(store.rows[0]!.nextAttemptAt.getTime()).toBe(5000)
    expect(log).toHaveLength(1)
    expect(log[0]).toMatch(
      /^\[mail\] could not send test mail a to a@test\.example \(attempt 1 of 3\): connect ECONNREFUSED.*next try in 5 s or a little later$/,
    )
    expect(await sendOutboxMessage(store, transport, config, 'a', l => log.push(l))).toBe('sent')
    expect(store.rows[0]!.sentAt).not.toBeNull()
    expect(transport.sent).toEqual([`a@test.example ${outboxMessageId('a')}`])
  })

  it('says it gives up on the last attempt and keeps the last error', async () => {
    const store = memoryStore([row('b')])
    const log: string[] = []
    for (let i = 0; i < 3; i++)
      await sendOutboxMessage(store, stubTransport(99), config, 'b', l => log.push(l)).catch(() => {})
    expect(store.rows[0]).toMatchObject({
      attempts: 3,
      sentAt: null,
      lastError: expect.stringContaining('ECONNREFUSED'),
    })
    expect(log[2]).toMatch(/attempt 3 of 3.*giving up$/)
  })

  it('never sends a row twice (a run retried after the send) or a row that is gone', async () => {
    const store = memoryStore([{ ...row('c'), sentAt: new Date(5) }])
    const transport = stubTransport(0)
    expect(await sendOutboxMessage(store, transport, config, 'c')).toBe('already-sent')
    expect(await sendOutboxMessage(store, transport, config, 'missing')).toBe('gone')
    expect(transport.calls).toBe(0)
  })

  it('matches a kept message to its outbox row by Message-ID', () => {
    const id = '3f2a0c1e-9b7d-4e61-8a55-0d2c4b6e7f10'
    expect(outboxIdOf(outboxMessageId(id))).toBe(id)
    expect(outboxIdOf('<abc@example.com>')).toBeNull()
    expect(outboxIdOf(null)).toBeNull()
  })
})
