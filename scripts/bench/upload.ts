// A 20 MB micrograph upload against the designs list: p50, p90 and p97.5 of GET /api/labs/:labId/designs at 10 connections,
// flat out and at a steady 200 req/s, alone and while 20 MB uncompressed TIFF micrographs are uploaded and measured one
// after another, with the server's event-loop delay beside each window (DW_LOOP_DELAY_FILE). The
// measurement runs in the imaging worker and decoding in sharp's own threads, so the list should not slow beyond
// noise. As the reference for that noise, windows with a process that only spins at the lowest CPU priority there is
// (SCHED_IDLE, `chrt --idle`: the kernel hands the CPU to anything else first) show what any background work at
// all costs the list on this machine. Not a test: `npm run bench:upload`.
import { spawn, spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { Worker } from 'node:worker_threads'
import autocannon from 'autocannon'
import sharp from 'sharp'
import { renderMicrograph, scatterDrops } from '../../shared/imaging/synthetic'
import { deleteObject, objectKey } from '../../server/services/storage'
import { startServer } from '../../tests/support/instance'

/** Uploads the micrograph again and again until told to stop, then reports how many and how long they took. */
const UPLOADER = `
const { parentPort, workerData } = require('node:worker_threads')
let stop = false
parentPort.once('message', () => { stop = true })
;(async () => {
  let count = 0, ms = 0
  const ids = []
  while (!stop) {
    const form = new FormData()
    form.set('image', new Blob([workerData.tiff]), 'big.tiff')
    form.set('umPerPx', '0.8')
    const t = performance.now()
    const res = await fetch(workerData.url, { method: 'POST', headers: { cookie: workerData.cookie }, body: form })
    const json = await res.json()
    if (res.status !== 201) throw new Error('upload answered ' + res.status)
    ids.push(json.micrograph.id)
    count++
    ms += performance.now() - t
  }
  parentPort.postMessage({ count, ms, ids })
})()
`
const DURATION_S = Number(process.env.DW_BENCH_SECONDS ?? 10)
/** The steady load: about a tenth of what the list serves flat out here (common practice for latency, no source). */
const STEADY_RATE = Number(process.env.DW_BENCH_RATE ?? 200)
const loopDelayFile = join(mkdtempSync(join(tmpdir(), 'dw-upload-')), 'loop-delay.jsonl')
const server = await startServer({
  databaseUrl: process.env.DATABASE_URL!,
  name: 'bench-upload',
  env: { DW_MAIL_WORKER: '0', DW_LOOP_DELAY_FILE: loopDelayFile },
})
const base = server.baseURL
try {
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'designer@quillmere.example', password: 'drop-demo-2026' }),
  })
  const cookie = login.headers
    .getSetCookie()
    .map(c => c.split(';')[0])
    .join('; ')
  const get = (path: string) => fetch(base + path, { headers: { cookie } }).then(r => r.json() as Promise<any>)
  const labId = (await get('/api/labs')).find((l: { slug: string }) => l.slug === 'quillmere').labId
  const design = (await get(`/api/labs/${labId}/designs`)).designs?.[0] ?? (await get(`/api/labs/${labId}/designs`))[0]
  const revisionId = design.latestRevisionId
  const run = await fetch(`${base}/api/labs/${labId}/revisions/${revisionId}/bench-runs`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json' },
    body: JSON.stringify({ source: 'micrograph', notes: 'upload benchmark' }),
  }).then(r => r.json() as Promise<any>)

  const size = 4600
  const { separated } = scatterDrops({ width: size, height: size, count: 2000, meanDiameter: 40, cv: 0.05, seed: 3 })
  const image = renderMicrograph({ width: size, height: size, drops: separated, seed: 3 })
  const tiff = await sharp(Buffer.from(image.data), { raw: { width: size, height: size, channels: 1 } })
    .toColourspace('b-w')
    .tiff({ compression: 'none' })
    .toBuffer()
  console.log(
    `[upload] micrograph: ${size} × ${size} px TIFF, ${(tiff.length / 1e6).toFixed(1)} MB, ${separated.length} drops`,
  )

  // Flat out (10 connections, as fast as the server answers) the list shares the 2 cores with the measurement, so
  // its throughput falls whatever runs where; at a steady rate well inside capacity (other people browsing while
  // one uploads) the latency shows whether the upload blocks anyone. Alone and uploading windows alternate, three
  // of each, so a drift of the machine shows as spread among the alone windows (the noise) rather than as a cost.
  const list = (rate?: number) =>
    autocannon({
      url: `${base}/api/labs/${labId}/designs`,
      connections: 10,
      duration: DURATION_S,
      headers: { cookie },
      ...(rate ? { overallRate: rate } : {}),
    })
  let uploads = 0
  let uploadMs = 0
  const uploaded: string[] = []
  // The uploads come from a thread of their own: sending 20 MB from autocannon's event loop would delay its
  // timers and show up as list latency that the server never caused.
  const whileUploading = async <T>(measure: () => Promise<T>): Promise<T> => {
    const uploader = new Worker(UPLOADER, {
      eval: true,
      workerData: { url: `${base}/api/labs/${labId}/bench-runs/${run.id}/micrographs`, cookie, tiff },
    })
    const done = new Promise<{ count: number; ms: number; ids: string[] }>((resolve, reject) => {
      uploader.on('message', resolve)
      uploader.on('error', reject)
    })
    try {
      return await measure()
    } finally {
      uploader.postMessage('stop')
      const { count, ms, ids } = await done
      await uploader.terminate()
      uploads += count
      uploadMs += ms
      uploaded.push(...ids)
    }
  }
  // The reference: one process that spins and does nothing else, at SCHED_IDLE where chrt exists, else nice 19.
  const idleClass = spawnSync('chrt', ['--idle', '0', 'true']).status === 0
  const whileSpinning = async <T>(measure: () => Promise<T>): Promise<T> => {
    const spin = [process.execPath, '-e', 'for (;;) {}']
    const spinner = idleClass ? spawn('chrt', ['--idle', '0', ...spin]) : spawn('nice', ['-n', '19', ...spin])
    try {
      return await measure()
    } finally {
      spinner.kill('SIGKILL')
    }
  }
  const delays = () =>
    readFileSync(loopDelayFile, 'utf8')
      .split('\n')
      .filter(Boolean)
      .map(line => JSON.parse(line) as { t: number; p50: number; p99: number; max: number })
  const windowed = async (name: string, measure: () => Promise<autocannon.Result>) => {
    const from = Date.now()
    const result = await measure()
    const seconds = delays().filter(d => d.t > from + 1000 && d.t <= Date.now())
    const p99s = seconds.map(d => d.p99).sort((a, b) => a - b)
    return {
      name,
      result,
      loopP99: p99s[Math.floor(p99s.length / 2)] ?? NaN,
      loopMax: Math.max(...seconds.map(d => d.max)),
    }
  }
  const rows: Awaited<ReturnType<typeof windowed>>[] = []
  rows.push(await windowed('flat out, alone', () => list()))
  rows.push(await windowed('flat out, uploading', () => whileUploading(() => list())))
  for (let i = 1; i <= 3; i++) {
    rows.push(await windowed(`${STEADY_RATE} req/s, alone #${i}`, () => list(STEADY_RATE)))
    rows.push(await windowed(`${STEADY_RATE} req/s, idle spinner #${i}`, () => whileSpinning(() => list(STEADY_RATE))))
    rows.push(await windowed(`${STEADY_RATE} req/s, uploading #${i}`, () => whileUploading(() => list(STEADY_RATE))))
  }
  for (const { name, result: r, loopP99, loopMax } of rows)
    console.log(
      `[upload] ${name.padEnd(26)} p50 ${r.latency.p50} ms, p90 ${r.latency.p90} ms, p97.5 ${r.latency.p97_5} ms, ` +
        `${Math.round(r.requests.average)} req/s; event loop delay p99 ${loopP99} ms, max ${loopMax} ms`,
    )
  const steady = (kind: string) => rows.filter(r => r.name.startsWith(`${STEADY_RATE}`) && r.name.includes(kind))
  const p975 = (list: typeof rows) => list.map(r => r.result.latency.p97_5)
  const alone = p975(steady('alone'))
  const busy = p975(steady('uploading'))
  const spun = p975(steady('spinner'))
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
  const ratio = (a: number[], b: number[]) => (median(a) / median(b)).toFixed(2)
  console.log(
    `[upload] at ${STEADY_RATE} req/s, p97.5 alone ${alone.join(' / ')} ms (noise: ${Math.min(...alone)}–${Math.max(...alone)}), ` +
      `${idleClass ? 'SCHED_IDLE' : 'nice 19'} spinner ${spun.join(' / ')} ms, uploading ${busy.join(' / ')} ms; ` +
      `median ${median(alone)} → ${median(busy)} ms, ratio ${ratio(busy, alone)}× alone, ${ratio(busy, spun)}× the spinner; ` +
      `${uploads} uploads of ${(tiff.length / 1e6).toFixed(1)} MB measured, ${(uploadMs / Math.max(1, uploads) / 1000).toFixed(1)} s each`,
  )
  // The bench's own files leave storage again (20 MB each, a few hundred MB a run).
  for (const id of uploaded)
    for (const name of ['original', 'view.png', 'thumbnail.jpg'])
      await deleteObject(objectKey(labId, 'micrographs', id, name))
} finally {
  await server.stop()
}
