// A large chip's revision summary from the "revision.summary" background job (pg-boss), over the real built server
// and PostgreSQL: the save answers at once with a pending summary, a job on one of several instances fills it in
// with what the inline path computes, and a finished summary never changes again (migration 0015).
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { planParallelChip } from '../../geometry/arrays'
import { documentPieceCount } from '../../shared/schemas/chip'
import { ApiClient } from '../support/api'
import { ROLES, type Role } from '../../shared/utils/roles'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { mailTo } from '../support/mail'
import { releasedOrder } from '../support/orders'
import { startServer, type ServerInstance } from '../support/instance'

const pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 2 })
// Two instances that summarise every chip over 1,000 drawn pieces in the background; the test project's own
// server keeps the default (5,000), so it computes the same chip inline.
const THRESHOLD = 1000
let a: ServerInstance
let b: ServerInstance
let labId: string
let email: string

beforeAll(async () => {
  const env = { DW_SUMMARY_INLINE_PIECES: String(THRESHOLD) }
  ;[a, b] = await Promise.all([
    startServer({ databaseUrl: inject('databaseUrl'), name: 'api-summary-a', env }),
    startServer({ databaseUrl: inject('databaseUrl'), name: 'api-summary-b', env }),
  ])
  const { lab, people } = await makeLab(['designer'])
  labId = lab.id
  email = people[0]!.email
})
afterAll(async () => {
  await Promise.all([a?.stop(), b?.stop()])
  await pool.end()
})

const as = (base?: string) => new ApiClient(base).signIn(email, TEST_PASSWORD)
const chip = (nozzles: number) => planParallelChip({ nozzles }).document
async function createDesign(client: ApiClient, name: string, document: unknown) {
  const res = await client.post(`/api/labs/${labId}/designs`, { name, document })
  expect(res.status, JSON.stringify(res.json)).toBe(201)
  return res.json.revisionId as string
}
const summaryOf = async (client: ApiClient, revisionId: string) =>
  (await client.get(`/api/labs/${labId}/revisions/${revisionId}`)).json.summary
async function finished(client: ApiClient, revisionId: string) {
  await expect
    .poll(async () => (await summaryOf(client, revisionId)).pending ?? false, { timeout: 60_000, interval: 250 })
    .toBe(false)
  return summaryOf(client, revisionId)
}

describe('revision summaries as a background job', () => {
  it('saves a large chip at once with a pending summary, then fills in what the inline path computes', async () => {
    const document = chip(1024)
    expect(documentPieceCount(document as never)).toBeGreaterThan(THRESHOLD) // over A's threshold
    expect(documentPieceCount(document as never)).toBeLessThan(5000) // under the default: inline on the main server
    const onA = await as(a.baseURL)
    const revisionId = await createDesign(onA, 'Background summary', document)
    // Read straight after the save: the job needs a poll (0.5 s) and about a second of geometry on this chip.
    const pending = await summaryOf(onA, revisionId)
    expect(pending.pending).toBe(true)
    expect(pending.junctions).toEqual([])
    expect(pending.counts.components).toBe((document as { components: unknown[] }).components.length)
    const done = await finished(onA, revisionId)
    expect(done.junctions.length).toBeGreaterThanOrEqual(1024)
    // The same document saved on the test project's server is summarised inline, in the request.
    const inline = await summaryOf(await as(), await createDesign(await as(), 'Inline summary', document))
    expect(inline.pending).toBeUndefined()
    expect(done).toEqual(inline)
    // The design's revision list and the cached read path answer the finished summary too.
    expect((await summaryOf(await as(b.baseURL), revisionId)).pending).toBeUndefined()
  })

  it('shares the jobs between instances: every pending summary is filled in once', async () => {
    const clients = [await as(a.baseURL), await as(b.baseURL)]
    const ids = await Promise.all(
      Array.from({ length: 8 }, (_, i) => createDesign(clients[i % 2]!, `Shared summary ${i}`, chip(320))),
    )
    for (const id of ids) expect((await finished(clients[0]!, id)).junctions.length).toBeGreaterThanOrEqual(320)
    const { rows } = await pool.query(
      `select state, retry_count, output from pgboss.job where name = 'revision.summary' and data->>'revisionId' = any($1)`,
      [ids],
    )
    expect(rows).toHaveLength(8) // one job per revision
    expect(rows.every(r => r.state === 'completed' && r.retry_count === 0)).toBe(true)
    const instances = new Set(rows.map(r => r.output.instance))
    expect(instances.size, `ran on ${[...instances].join(', ')}`).toBeGreaterThanOrEqual(2)
  })

  it('never changes a finished summary, and never makes one pending again (database trigger)', async () => {
    const onA = await as(a.baseURL)
    const revisionId = await createDesign(onA, 'Immutable summary', chip(320))
    await finished(onA, revisionId)
    await expect(
      pool.query(`update revisions set summary = summary || '{"pending": true}' where id = $1`, [revisionId]),
    ).rejects.toThrow(/immutable/)
    await expect(
      pool.query(`update revisions set summary = summary || '{"processId": "other"}' where id = $1`, [revisionId]),
    ).rejects.toThrow(/immutable/)
  })

  it('keeps small chips inline: no job, a finished summary in the save itself', async () => {
    const onA = await as(a.baseURL)
    const revisionId = await createDesign(onA, 'Small chip', chip(8))
    expect((await summaryOf(onA, revisionId)).pending).toBeUndefined()
    const { rows } = await pool.query(
      `select 1 from pgboss.job where name = 'revision.summary' and data->>'revisionId' = $1`,
      [revisionId],
    )
    expect(rows).toEqual([])
  })

  it("records a large chip's as-built at once; the job fills in the comparison and then mails the designer", async () => {
    const { lab, people } = await makeLab([...ROLES])
    const as = {} as Record<Role, ApiClient>
    const ids = {} as Record<Role, string>
    for (const p of people) {
      as[p.role] = await new ApiClient(a.baseURL).signIn(p.email, TEST_PASSWORD)
      ids[p.role] = p.id
    }
    const document = chip(320) as { layers: Array<{ id: string; depth: number }> }
    const { revisionId } = await releasedOrder({ lab, as, ids, designId: '', revisionId: '' }, {}, document)
    const base = `/api/labs/${lab.id}/revisions/${revisionId}/as-built`
    const layer = document.layers[0]!
    const recorded = await as.fabricator.post(base, {
      depths: [{ layerId: layer.id, depthUm: layer.depth * 0.8 }],
      note: 'Large chip, one depth',
    })
    expect(recorded.status, JSON.stringify(recorded.json)).toBe(201)
    expect(recorded.json.pending).toBe(true)
    expect(recorded.json.changes).toEqual([])
    await expect
      .poll(async () => (await as.designer.get(base)).json.asBuilt.pending, { timeout: 60_000, interval: 250 })
      .toBe(false)
    const seen = (await as.designer.get(base)).json.asBuilt
    expect(seen.summary.pending).toBeUndefined()
    expect(seen.summary.junctions.length).toBeGreaterThanOrEqual(320)
    expect(seen.changes.length).toBeGreaterThan(0) // a 20 % shallower chip changes the forecast
    const designer = people.find(p => p.role === 'designer')!.email
    await expect
      .poll(() => mailTo(designer).some(m => m.subject.startsWith('As-built recorded')), { timeout: 20_000 })
      .toBe(true)
    const { rows } = await pool.query(
      `select state from pgboss.job where name = 'as-built.summary' and data->>'asBuiltId' = $1`,
      [recorded.json.asBuiltId],
    )
    expect(rows.map(r => r.state)).toContain('completed')
    expect(mailTo(designer).filter(m => m.subject.startsWith('As-built recorded'))).toHaveLength(1) // sent once
  }, 90_000)
})
