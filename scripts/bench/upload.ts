// A 20 MB micrograph upload against the designs list: p50, p90 and p97.5 of GET /api/labs/:labId/designs at 10 connections,
// flat out and at a steady 200 req/s, first alone, then while 20 MB uncompressed TIFF micrographs are uploaded and measured one after another. The
// measurement runs in the imaging worker and decoding in sharp's own threads, so the list should not slow beyond
// noise. Not a test: `npm run bench:upload`.
import autocannon from 'autocannon'
import sharp from 'sharp'
import { renderMicrograph, scatterDrops } from '../../shared/imaging/synthetic'
import { startServer } from '../../tests/support/instance'

const DURATION_S = Number(process.env.DW_BENCH_SECONDS ?? 10)
/** The steady load: about a tenth of what the list serves flat out here (common practice for latency, no source). */
const STEADY_RATE = Number(process.env.DW_BENCH_RATE ?? 200)
const server = await startServer({
  databaseUrl: process.env.DATABASE_URL!,
  name: 'bench-upload',
  env: { DW_MAIL_WORKER: '0' },
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
  // one uploads) the latency shows whether the upload blocks anyone.
  const list = (rate?: number) =>
    autocannon({
      url: `${base}/api/labs/${labId}/designs`,
      connections: 10,
      duration: DURATION_S,
      headers: { cookie },
      ...(rate ? { overallRate: rate } : {}),
    })
  const quiet = await list()
  const quietSteady = await list(STEADY_RATE)
  let uploads = 0
  let uploadMs = 0
  let stop = false
  const uploading = (async () => {
    while (!stop) {
      const form = new FormData()
      form.set('image', new Blob([new Uint8Array(tiff)]), 'big.tiff')
      form.set('umPerPx', '0.8')
      const t = performance.now()
      const res = await fetch(`${base}/api/labs/${labId}/bench-runs/${run.id}/micrographs`, {
        method: 'POST',
        headers: { cookie },
        body: form,
      })
      await res.text()
      if (res.status !== 201) {
        console.log(`[upload] upload answered ${res.status}`)
        break
      }
      uploads++
      uploadMs += performance.now() - t
    }
  })()
  const busy = await list()
  const busySteady = await list(STEADY_RATE)
  stop = true
  await uploading
  const row = (name: string, r: autocannon.Result) =>
    `${name}p50 ${r.latency.p50} ms, p90 ${r.latency.p90} ms, p97.5 ${r.latency.p97_5} ms (autocannon has no p95), ${r.requests.average} req/s`
  console.log(`[upload] designs list alone       ${row('', quiet)}`)
  console.log(`[upload] designs list, uploading  ${row('', busy)}`)
  console.log(`[upload] at ${STEADY_RATE} req/s, alone      ${row('', quietSteady)}`)
  console.log(
    `[upload] at ${STEADY_RATE} req/s, uploading  ${row('', busySteady)}; ${uploads} uploads of 20 MB measured in all, ${(uploadMs / Math.max(1, uploads) / 1000).toFixed(1)} s each`,
  )
} finally {
  await server.stop()
}
