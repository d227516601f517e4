// API load figures: p50/p95 latency and requests per second at 20 connections, against the built server and the
// real PostgreSQL. Targets (issue): reads p95 < 50 ms, writes p95 < 150 ms on a 2-core machine. Not a test.
import { spawn } from 'node:child_process'
import { createServer } from 'node:net'
import autocannon from 'autocannon'
import { generateParallelChip } from '../../geometry/arrays'

const CONNECTIONS = 20
const DURATION_S = Number(process.env.DW_BENCH_SECONDS ?? 10)
const EMAIL = 'designer@quillmere.example'
const PASSWORD = 'drop-demo-2026'

const port = await new Promise<number>(resolve => { const s = createServer().listen(0, '127.0.0.1', () => { const p = (s.address() as { port: number }).port; s.close(() => resolve(p)) }) })
const base = `http://127.0.0.1:${port}`
const server = spawn(process.execPath, ['.output/server/index.mjs'], { env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), DW_MAIL_WORKER: '0' }, stdio: 'ignore' })
try {
  for (let i = 0; i < 100; i++) { try { if ((await fetch(`${base}/api/health`)).ok) break } catch {} await new Promise(r => setTimeout(r, 100)) }
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: EMAIL, password: PASSWORD }) })
  const cookie = login.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
  const json = (path: string, method = 'GET', body?: unknown) => fetch(base + path, { method, headers: { cookie, 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) }).then(r => r.json() as Promise<any>)
  const labId = (await json('/api/labs')).find((l: { slug: string }) => l.slug === 'quillmere').labId
  const document = generateParallelChip({ nozzles: 512, name: 'Bench chip, 512 nozzles' })
  const t0 = performance.now()
  const created = await json(`/api/labs/${labId}/designs`, 'POST', { name: `Bench ${new Date().toISOString()}`, document })
  console.log(`create a design holding the 512-nozzle document: ${(performance.now() - t0).toFixed(0)} ms (${(JSON.stringify(document).length / 1024).toFixed(0)} KiB, summary with forecast and rules)`)
  // Writes spread over 20 designs, one per connection, as 20 people saving their own work would.
  const smalls = await Promise.all(Array.from({ length: CONNECTIONS }, (_, i) => json(`/api/labs/${labId}/designs`, 'POST', { name: `Bench small ${Date.now()}-${i}` })))
  const small = smalls[0]
  const starter = await json(`/api/labs/${labId}/revisions/${small.revisionId}`).then(r => r.document)
  let turn = 0

  const cases = [
    { name: 'list designs (read)', target: 50, opts: { path: `/api/labs/${labId}/designs` } },
    { name: 'open a 512-nozzle revision (read)', target: 50, opts: { path: `/api/labs/${labId}/revisions/${created.revisionId}` } },
    { name: 'save a revision (write, starter chip, 20 designs)', target: 150, opts: { path: `/api/labs/${labId}/designs/${small.designId}/revisions`, method: 'POST', requests: [{ setupRequest: (req: Record<string, unknown>) => {
      const d = smalls[turn++ % smalls.length]
      return { ...req, path: `/api/labs/${labId}/designs/${d.designId}/revisions`, body: JSON.stringify({ parentId: d.revisionId, message: 'bench', document: starter, branch: true }) }
    } }] } },
    { name: 'post a comment (write)', target: 150, opts: { path: `/api/labs/${labId}/revisions/${small.revisionId}/threads`, method: 'POST', body: JSON.stringify({ anchor: { x: 5000, y: 3000 }, body: 'bench comment' }) } },
  ]
  console.log(`\nAPI at ${CONNECTIONS} connections, ${DURATION_S} s each (built server, real PostgreSQL)`)
  console.log('case'.padEnd(52), 'p50 ms'.padStart(8), 'p95 ms'.padStart(8), 'req/s'.padStart(8), 'target p95'.padStart(11), ' ok')
  for (const c of cases) {
    const { path, ...rest } = c.opts as { path: string, method?: string, body?: string, requests?: unknown[] }
    const r = await autocannon({ url: base + path, connections: CONNECTIONS, duration: DURATION_S, headers: { cookie, 'content-type': 'application/json' }, ...rest } as autocannon.Options)
    const p95 = (r.latency as unknown as Record<string, number>).p95 ?? r.latency.p97_5
    const bad = r.non2xx + r.errors
    console.log(c.name.padEnd(52), String(r.latency.p50).padStart(8), String(p95).padStart(8), r.requests.average.toFixed(0).padStart(8), `< ${c.target}`.padStart(11), p95 < c.target && bad === 0 ? ' yes' : ` NO${bad ? ` (${bad} failed)` : ''}`)
  }
  // Leave the demo lab's list as it was: archive what the bench created.
  for (const d of [created, ...smalls]) await json(`/api/labs/${labId}/designs/${d.designId}`, 'PATCH', { archived: true })
} finally {
  server.kill('SIGTERM')
}
