// Background jobs on pg-boss over the real built server and PostgreSQL: two server instances share one queue,
// a job queued in a transaction exists only if that transaction commits, failed jobs are retried with back-off,
// copied to their dead-letter queue and listed for their own lab's admins only.
import { randomUUID } from 'node:crypto'
import { sql } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import * as schema from '../../server/db/schema'
import { closeDb } from '../../server/utils/db'
import { enqueueJob } from '../../server/utils/jobs'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { startServer, type ServerInstance } from '../support/instance'

const pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 2 })
const db = drizzle(pool, { schema })
const as = (email: string) => new ApiClient().signIn(email, TEST_PASSWORD)
const jobsWith = async (marker: string) =>
  (
    await pool.query(
      `select name, state, retry_count, output, started_on, completed_on from pgboss.job where data->>'marker' = $1 order by created_on`,
      [marker],
    )
  ).rows

let second: ServerInstance
beforeAll(async () => {
  second = await startServer({ databaseUrl: inject('databaseUrl'), name: 'api-jobs-second' })
})
afterAll(async () => {
  await second?.stop()
  await pool.end()
  await closeDb()
})

describe('background jobs (pg-boss)', () => {
  it('shares one queue between two server instances: every job runs once, on either', async () => {
    const marker = randomUUID()
    const ids = await Promise.all(Array.from({ length: 24 }, () => enqueueJob('diagnostic.echo', { marker, ms: 500 })))
    expect(new Set(ids).size).toBe(24)
    await expect
      .poll(async () => (await jobsWith(marker)).filter(j => j.state === 'completed').length, {
        timeout: 40_000,
        interval: 250,
      })
      .toBe(24)
    const jobs = await jobsWith(marker)
    expect(jobs.every(j => j.retry_count === 0)).toBe(true) // none ran twice
    const instances = new Set(jobs.map(j => j.output.instance))
    // At least this project's server and the second one; in a full run the browser project's server shares the
    // test database, and so the queue, too.
    expect(instances.size, `ran on ${[...instances].join(', ')}`).toBeGreaterThanOrEqual(2)
    expect(instances).toContain(new URL(second.baseURL).port)
  })

  it("writes a job in the caller's transaction: a rolled-back change leaves no job, a committed one runs", async () => {
    const [kept, dropped] = [randomUUID(), randomUUID()]
    await expect(
      db.transaction(async tx => {
        await enqueueJob('diagnostic.echo', { marker: dropped }, { tx })
        expect(await jobsWith(dropped)).toEqual([]) // not visible outside the transaction yet
        throw new Error('the change fails')
      }),
    ).rejects.toThrow('the change fails')
    await db.transaction(async tx => {
      await tx.execute(sql`select 1`)
      await enqueueJob('diagnostic.echo', { marker: kept }, { tx })
    })
    await expect.poll(async () => (await jobsWith(kept)).map(j => j.state), { timeout: 10_000 }).toEqual(['completed'])
    expect(await jobsWith(dropped)).toEqual([])
  })

  it("retries a failing job with back-off, then copies it to the dead-letter queue and lists it for its lab's admins", async () => {
    const {
      lab,
      people: [admin, designer],
    } = await makeLab(['admin', 'designer'])
    const {
      lab: other,
      people: [otherAdmin],
    } = await makeLab(['admin'])
    const marker = randomUUID()
    const id = await enqueueJob('diagnostic.fail', {
      labId: lab.id,
      marker,
      message: 'the micrograph could not be read',
    })
    // retryLimit 2, retryDelay 1 s with back-off: three runs, about 1–2 s then 2–4 s apart.
    await expect
      .poll(async () => (await jobsWith(marker)).find(j => j.name === 'diagnostic.fail')?.state, {
        timeout: 20_000,
        interval: 250,
      })
      .toBe('failed')
    const jobs = await jobsWith(marker)
    const failed = jobs.find(j => j.name === 'diagnostic.fail')!
    expect(failed.retry_count).toBe(2)
    expect(failed.output.message).toBe('the micrograph could not be read')
    expect(jobs.filter(j => j.name === 'diagnostic.fail.dead')).toHaveLength(1)

    const a = await as(admin!.email)
    const list = await a.get(`/api/labs/${lab.id}/jobs/failed`)
    expect(list.status).toBe(200)
    expect(list.json.jobs).toEqual([
      expect.objectContaining({
        id,
        name: 'diagnostic.fail',
        state: 'failed',
        attempts: 3,
        retryLimit: 2,
        error: 'the micrograph could not be read',
        failedAt: expect.any(String),
      }),
    ])
    expect((await (await as(designer!.email)).get(`/api/labs/${lab.id}/jobs/failed`)).status).toBe(403)
    const o = await as(otherAdmin!.email)
    expect((await o.get(`/api/labs/${lab.id}/jobs/failed`)).status).toBe(404)
    expect((await o.get(`/api/labs/${other.id}/jobs/failed`)).json.jobs).toEqual([])
  }, 40_000)
})
