// Data safety: `npm run db:backup` / `db:restore` round-trip the test database into a scratch database, and the
// revisions table refuses TRUNCATE from the app's own database user.
import { execFile } from 'node:child_process'
import { randomUUID } from 'node:crypto'
import { mkdtempSync, rmSync, statSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { promisify } from 'node:util'
import pg from 'pg'
import { afterAll, describe, expect, inject, it } from 'vitest'
import { labWithDesign } from '../support/designs'

const run = promisify(execFile)
const root = new URL('../..', import.meta.url).pathname

function withDb(url: string) {
  return async <T>(fn: (client: pg.Client) => Promise<T>) => {
    const client = new pg.Client({ connectionString: url })
    await client.connect()
    try {
      return await fn(client)
    } finally {
      await client.end()
    }
  }
}

const urlFor = (base: string, name: string) => {
  const u = new URL(base)
  u.pathname = `/${name}`
  return u.toString()
}

/** Row count of every table (all schemas, the migrations journal included) and a checksum of every revision. */
async function fingerprint(url: string) {
  return withDb(url)(async c => {
    const { rows: tables } = await c.query<{ name: string }>(
      `select format('%I.%I', schemaname, tablename) as name from pg_tables
        where schemaname not in ('pg_catalog', 'information_schema') order by 1`,
    )
    const counts: Record<string, number> = {}
    for (const { name } of tables) counts[name] = Number((await c.query(`select count(*) from ${name}`)).rows[0].count)
    const {
      rows: [sums],
    } = await c.query(`
      select md5(coalesce(string_agg(id::text || ':' || document::text, ',' order by id), '')) as documents,
             md5(coalesce(string_agg(id::text || ':' || summary::text, ',' order by id), '')) as summaries
        from revisions`)
    return { counts, documents: sums.documents as string, summaries: sums.summaries as string }
  })
}

describe('backup and restore (pg_dump custom format)', () => {
  const databaseUrl = inject('databaseUrl')
  const scratch = `dw_restore_${randomUUID().slice(0, 8)}`
  const dir = mkdtempSync(join(tmpdir(), 'dw-backup-'))
  const env = { ...process.env, DATABASE_URL: databaseUrl, TEST_DATABASE_URL: databaseUrl }

  afterAll(async () => {
    await withDb(urlFor(databaseUrl, 'postgres'))(c => c.query(`drop database if exists ${scratch} with (force)`))
    rmSync(dir, { recursive: true, force: true })
  })

  it('restores the test database into a scratch database with every row and every revision document', async () => {
    await labWithDesign() // at least one lab, design, revision and activity row of our own
    const file = join(dir, 'test.dump')
    const before = await fingerprint(databaseUrl)
    await run('bash', ['scripts/db-backup.sh', file], { cwd: root, env })
    const after = await fingerprint(databaseUrl)
    expect(after, 'the test database changed during the backup: the comparison would mean nothing').toEqual(before)
    expect(statSync(file).size).toBeGreaterThan(1000)
    expect(before.counts['public.revisions']).toBeGreaterThan(0)

    await run('bash', ['scripts/db-restore.sh', file, scratch], { cwd: root, env })
    const restored = await fingerprint(urlFor(databaseUrl, scratch))
    expect(restored.counts).toEqual(before.counts)
    expect(restored.documents).toBe(before.documents)
    expect(restored.summaries).toBe(before.summaries)

    // The restored database keeps its guards: revisions stay immutable there too.
    await withDb(urlFor(databaseUrl, scratch))(async c => {
      await expect(
        c.query(`update revisions set message = 'changed' where id = (select id from revisions limit 1)`),
      ).rejects.toThrow(/immutable/)
    })
    // A second restore into a database that now holds tables refuses without --replace and leaves it as it was.
    const refused = await run('bash', ['scripts/db-restore.sh', file, scratch], { cwd: root, env }).catch(
      (e: { code: number; stderr: string }) => e,
    )
    expect(refused).toMatchObject({ code: 1, stderr: expect.stringMatching(/already holds \d+ tables: add --replace/) })
    await run('bash', ['scripts/db-restore.sh', file, scratch, '--replace'], { cwd: root, env })
    expect((await fingerprint(urlFor(databaseUrl, scratch))).counts).toEqual(before.counts)
  }, 120_000)
})

describe('revisions cannot be wiped', () => {
  // Inside a transaction that is always rolled back, so a missing trigger cannot empty the test database.
  const tryAsAppUser = (statement: string) =>
    withDb(inject('databaseUrl'))(async c => {
      await c.query('begin')
      try {
        await c.query(statement)
        return null
      } catch (e) {
        return e as Error
      } finally {
        await c.query('rollback')
      }
    })

  it("TRUNCATE revisions fails with the trigger's message", async () => {
    const error = await tryAsAppUser('truncate revisions cascade')
    expect(error?.message).toMatch(/revisions are immutable and cannot be truncated/)
  })

  it('TRUNCATE designs CASCADE (which would take the revisions with it) fails the same way', async () => {
    const error = await tryAsAppUser('truncate designs cascade')
    expect(error?.message).toMatch(/revisions are immutable and cannot be truncated/)
  })
})
