// API load and chaos figures against the built server and the real PostgreSQL (test database). Not a test.
// Load: p50/p95 latency and requests per second at 20 and 100 connections (100 exhausts the pool of 10), including
// the designs list of a lab with 10,000 designs (seeded once, straight into the database).
// Targets (issue): reads p95 < 50 ms, writes p95 < 150 ms at 20 connections on a 2-core machine.
// Chaos: 100 connections saving onto one design's stale parent (every answer must be 409, none 5xx); and the
// database cut for 2 s under load (503 meanwhile, never 500; time until the first answer after it is back).
import autocannon from 'autocannon'
import pg from 'pg'
import { generateParallelChip } from '../../geometry/arrays'
import { startServer } from '../../tests/support/instance'
import { startTcpProxy } from '../../tests/support/tcpProxy'

const LEVELS = [20, 100]
const DURATION_S = Number(process.env.DW_BENCH_SECONDS ?? 10)
const EMAIL = 'designer@quillmere.example'
const PASSWORD = 'drop-demo-2026'
const databaseUrl = process.env.DATABASE_URL!
const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))
const LARGE_LAB_DESIGNS = 10_000

/**
 * A lab of 10,000 designs (each with one small revision), the demo designer in it, written straight to the database
 * in a few statements; made once per database (found again by its slug).
 */
async function largeLab(): Promise<string> {
  const client = new pg.Client({ connectionString: databaseUrl })
  await client.connect()
  try {
    const slug = 'bench-ten-thousand'
    const found = await client.query<{ id: string }>('select id from labs where slug = $1', [slug])
    if (found.rows[0]) return found.rows[0].id
    await client.query('begin')
    const lab = (
      await client.query<{ id: string }>(
        `insert into labs (slug, name) values ($1, 'Bench lab, 10,000 designs') returning id`,
        [slug],
      )
    ).rows[0]!.id
    const user = (await client.query<{ id: string }>('select id from users where email = $1', [EMAIL])).rows[0]!.id
    await client.query(`insert into memberships (user_id, lab_id, role) values ($1, $2, 'designer')`, [user, lab])
    await client.query(
      `insert into designs (lab_id, name, created_by, updated_at, created_at, junction_kinds, revision_count)
      select $1, 'Array chip ' || lpad(g::text, 5, '0'), $2, now() - g * interval '1 minute', now() - g * interval '1 minute', '{step-array}', 1
      from generate_series(1, ${LARGE_LAB_DESIGNS}) g`,
      [lab, user],
    )
    await client.query(
      `insert into revisions (design_id, lab_id, number, author_id, message, document, summary)
      select id, lab_id, 1, $2, 'First revision', '{}'::jsonb, '{}'::jsonb from designs where lab_id = $1`,
      [lab, user],
    )
    await client.query(
      'update designs d set latest_revision_id = r.id from revisions r where r.design_id = d.id and d.lab_id = $1',
      [lab],
    )
    await client.query('commit')
    await client.query('analyze designs')
    await client.query('analyze revisions')
    return lab
  } finally {
    await client.end()
  }
}

/** The database's own time for the first page's query and the count (EXPLAIN ANALYZE), apart from HTTP and load. */
async function explainFirstPage(labId: string): Promise<string> {
  const client = new pg.Client({ connectionString: databaseUrl })
  await client.connect()
  try {
    const time = async (query: string) => {
      const plan = (
        await client.query<{ 'QUERY PLAN': string }>(`explain (analyze, format text) ${query}`, [labId])
      ).rows.map(r => r['QUERY PLAN'])
      return `${plan.find(line => line.startsWith('Execution Time'))?.replace('Execution Time: ', '')} (${/Index Scan|Index Only Scan/.test(plan.join()) ? 'index' : 'sequential scan'})`
    }
    const page =
      await time(`select d.id, d.name, r.number, r.status, u.name from designs d left join revisions r on r.id = d.latest_revision_id
      left join users u on u.id = r.author_id where d.lab_id = $1 and d.archived_at is null order by d.updated_at desc, d.id desc limit 50`)
    const count = await time('select count(*) from designs d where d.lab_id = $1 and d.archived_at is null')
    return `first page ${page}, count ${count}`
  } finally {
    await client.end()
  }
}

const server = await startServer({ databaseUrl, name: 'bench-api', env: { DW_MAIL_WORKER: '0' } })
const base = server.baseURL
try {
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: EMAIL, password: PASSWORD }),
  })
  const cookie = login.headers
    .getSetCookie()
    .map(c => c.split(';')[0])
    .join('; ')
  const headers = { cookie, 'content-type': 'application/json' }
  const json = (path: string, method = 'GET', body?: unknown) =>
    fetch(base + path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) }).then(
      r => r.json() as Promise<any>,
    )
  const labId = (await json('/api/labs')).find((l: { slug: string }) => l.slug === 'quillmere').labId
  const seeded = performance.now()
  const largeLabId = await largeLab()
  const firstPage = await fetch(`${base}/api/labs/${largeLabId}/designs`, { headers })
  console.log(
    `lab of ${LARGE_LAB_DESIGNS.toLocaleString('en-GB')} designs ready in ${(performance.now() - seeded).toFixed(0)} ms; first page: ${((await firstPage.json()) as unknown[]).length} rows of X-Total-Count ${firstPage.headers.get('x-total-count')}`,
  )
  console.log(`  in the database alone: ${await explainFirstPage(largeLabId)}`)
  const document = generateParallelChip({ nozzles: 512, name: 'Bench chip, 512 nozzles' })
  const t0 = performance.now()
  const created = await json(`/api/labs/${labId}/designs`, 'POST', {
    name: `Bench ${new Date().toISOString()}`,
    document,
  })
  console.log(
    `create a design holding the 512-nozzle document: ${(performance.now() - t0).toFixed(0)} ms (${(JSON.stringify(document).length / 1024).toFixed(0)} KiB, summary with forecast and rules)`,
  )
  // Writes spread over one design per connection, as that many people saving their own work would.
  const smalls = await Promise.all(
    Array.from({ length: Math.max(...LEVELS) }, (_, i) =>
      json(`/api/labs/${labId}/designs`, 'POST', { name: `Bench small ${Date.now()}-${i}` }),
    ),
  )
  const small = smalls[0]
  const starter = await json(`/api/labs/${labId}/revisions/${small.revisionId}`).then(r => r.document)

  const run = (path: string, connections: number, rest: Record<string, unknown> = {}) =>
    autocannon({ url: base + path, connections, duration: DURATION_S, headers, ...rest } as autocannon.Options)
  const codes = (r: autocannon.Result) =>
    Object.entries((r as unknown as { statusCodeStats: Record<string, { count: number }> }).statusCodeStats ?? {})
      .map(([c, s]) => `${c}×${s.count}`)
      .join(' ')

  for (const connections of LEVELS) {
    let turn = 0
    const cases = [
      { name: 'list designs (read)', target: 50, path: `/api/labs/${labId}/designs`, rest: {} },
      {
        name: `list designs, ${LARGE_LAB_DESIGNS.toLocaleString('en-GB')}-design lab, first page (read)`,
        target: 50,
        path: `/api/labs/${largeLabId}/designs`,
        rest: {},
      },
      {
        name: `  same, by name, page 100 (read)`,
        target: 50,
        path: `/api/labs/${largeLabId}/designs?sort=name&dir=asc&page=100`,
        rest: {},
      },
      {
        name: `  same, search "chip 09" (read)`,
        target: 50,
        path: `/api/labs/${largeLabId}/designs?q=chip%2009`,
        rest: {},
      },
      {
        name: 'open a 512-nozzle revision (read)',
        target: 50,
        path: `/api/labs/${labId}/revisions/${created.revisionId}`,
        rest: {},
      },
      {
        name: `save a revision (write, starter chip, ${connections} designs)`,
        target: 150,
        path: `/api/labs/${labId}/designs/${small.designId}/revisions`,
        rest: {
          method: 'POST',
          requests: [
            {
              setupRequest: (req: Record<string, unknown>) => {
                const d = smalls[turn++ % connections]
                return {
                  ...req,
                  path: `/api/labs/${labId}/designs/${d.designId}/revisions`,
                  body: JSON.stringify({ parentId: d.revisionId, message: 'bench', document: starter, branch: true }),
                }
              },
            },
          ],
        },
      },
      {
        name: 'post a comment (write)',
        target: 150,
        path: `/api/labs/${labId}/revisions/${small.revisionId}/threads`,
        rest: { method: 'POST', body: JSON.stringify({ anchor: { x: 5000, y: 3000 }, body: 'bench comment' }) },
      },
    ]
    console.log(`\nAPI at ${connections} connections, ${DURATION_S} s each (built server, real PostgreSQL, pool of 10)`)
    console.log(
      'case'.padEnd(58),
      'p50 ms'.padStart(8),
      'p95 ms'.padStart(8),
      'req/s'.padStart(8),
      'target p95'.padStart(11),
      ' ok',
    )
    for (const c of cases) {
      const r = await run(c.path, connections, c.rest)
      const p95 = (r.latency as unknown as Record<string, number>).p95 ?? r.latency.p97_5
      const bad = r.non2xx + r.errors + r.timeouts
      const judged =
        connections === 20
          ? p95 < c.target && bad === 0
            ? ' yes'
            : ` NO${bad ? ` (${bad} failed)` : ''}`
          : bad === 0
            ? ' (no target; 0 failed)'
            : ` ${bad} failed`
      console.log(
        c.name.padEnd(58),
        String(r.latency.p50).padStart(8),
        String(p95).padStart(8),
        r.requests.average.toFixed(0).padStart(8),
        (connections === 20 ? `< ${c.target}` : '—').padStart(11),
        judged,
      )
    }
  }

  // Chaos 1: everyone saves onto the same stale parent of one design. Every answer must be 409; none 5xx, none late.
  const race = smalls[1]
  await json(`/api/labs/${labId}/designs/${race.designId}/revisions`, 'POST', {
    parentId: race.revisionId,
    message: 'moves the latest on',
    document: starter,
  })
  const r = await run(`/api/labs/${labId}/designs/${race.designId}/revisions`, 100, {
    method: 'POST',
    body: JSON.stringify({ parentId: race.revisionId, message: 'stale', document: starter }),
  })
  console.log(
    `\nchaos: 100 connections saving onto one design's stale parent, ${DURATION_S} s: ${r.requests.total} answers (${codes(r)}), p95 ${(r.latency as unknown as Record<string, number>).p95 ?? r.latency.p97_5} ms, ${r.timeouts} timed out, ${r.errors} errors`,
  )

  // Chaos 2: the database goes away for 2 s under 20 connections of reads, on an instance behind a TCP proxy.
  const url = new URL(databaseUrl)
  const proxy = await startTcpProxy({ host: url.hostname, port: Number(url.port || 5432) })
  url.host = `127.0.0.1:${proxy.port}`
  const behind = await startServer({
    databaseUrl: url.toString(),
    name: 'bench-api-chaos',
    env: { DW_MAIL_WORKER: '0' },
  })
  try {
    const cannon = autocannon({
      url: `${behind.baseURL}/api/labs/${labId}/designs`,
      connections: 20,
      duration: 8,
      headers,
    } as autocannon.Options)
    await sleep(2000)
    await proxy.cut()
    await sleep(2000)
    await proxy.restore()
    const back = performance.now()
    let recovered = NaN
    for (let i = 0; i < 100; i++) {
      const res = await fetch(`${behind.baseURL}/api/labs/${labId}/designs`, { headers })
      if (res.status === 200) {
        recovered = performance.now() - back
        break
      }
      await sleep(50)
    }
    const c = await cannon
    console.log(
      `chaos: database cut for 2 s under 20 connections of reads, 8 s: ${c.requests.total} answers (${codes(c)}), ${c.errors} socket errors; first 200 ${recovered.toFixed(0)} ms after it came back; server ${behind.child.exitCode === null ? 'still running' : 'EXITED'}`,
    )
  } finally {
    await behind.stop()
    await proxy.close()
  }
  // Leave the demo lab's list as it was: archive what the bench created.
  for (const d of [created, ...smalls])
    await json(`/api/labs/${labId}/designs/${d.designId}`, 'PATCH', { archived: true })
} finally {
  await server.stop()
}
