// Editor speed on the 512-nozzle chip in headless Chromium: time until the canvas is interactive, frame times
// while a junction is dragged for 2 s, and the time from releasing the drag to updated forecast labels.
// Targets (issue): interactive < 2 s, p95 frame < 20 ms, labels < 100 ms (the first drag; four more give the spread).
// Prints figures; not a test.
import { spawn } from 'node:child_process'
import { createServer } from 'node:net'
import { chromium } from 'playwright-core'
import { generateParallelChip } from '../../geometry/arrays'

const EMAIL = 'designer@quillmere.example'
const PASSWORD = 'drop-demo-2026'
const port = await new Promise<number>(resolve => { const s = createServer().listen(0, '127.0.0.1', () => { const p = (s.address() as { port: number }).port; s.close(() => resolve(p)) }) })
const base = `http://127.0.0.1:${port}`
const server = spawn(process.execPath, ['.output/server/index.mjs'], { env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), DW_MAIL_WORKER: '0' }, stdio: 'ignore' })
const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'] })
const pct = (xs: number[], p: number) => { const s = [...xs].sort((a, b) => a - b); return s[Math.min(s.length - 1, Math.floor(p * s.length))]! }
try {
  for (let i = 0; i < 100; i++) { try { if ((await fetch(`${base}/api/health`)).ok) break } catch {} await new Promise(r => setTimeout(r, 100)) }
  const page = await (await browser.newContext({ baseURL: base, viewport: { width: 1440, height: 900 } })).newPage()
  await page.goto('/sign-in')
  await page.fill('#email', EMAIL); await page.fill('#password', PASSWORD); await page.click('button[type=submit]')
  await page.waitForURL(/\/labs\//)
  const labs = await page.evaluate(() => fetch('/api/labs').then(r => r.json()))
  const labId = labs.find((l: { slug: string }) => l.slug === 'quillmere').labId
  const document = generateParallelChip({ nozzles: 512, name: 'Bench chip, 512 nozzles' })
  const created = await page.evaluate(([url, body]) => fetch(url as string, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }).then(r => r.json()), [`/api/labs/${labId}/designs`, { name: `Browser bench ${Date.now()}`, document }] as const)

  // Time to interactive: navigation start → canvas mounted with the chip drawn and the first forecast in.
  await page.goto(`/labs/${labId}/designs/${created.designId}/edit`)
  await page.waitForFunction(() => (window as any).__dwEditor?.live.value.summary, null, { timeout: 30_000 })
  const [mounted, firstForecast] = await page.evaluate(() => [performance.getEntriesByName('editor-canvas:mounted')[0]?.startTime ?? 0, (window as any).__dwEditor.live.value.at])
  const tti = Math.max(mounted, firstForecast)

  // Drag one nozzle for two seconds, recording every animation frame.
  const target = await page.evaluate(() => {
    const { store, canvas } = (window as any).__dwEditor
    const c = store.doc.components[Math.floor(store.doc.components.length / 2)]
    const v = canvas.value.view
    const r = window.document.querySelector('[data-test="editor-canvas"]')!.getBoundingClientRect()
    canvas.value.setView({ scale: v.scale * 8, tx: r.width / 2 - v.scale * 8 * c.position.x, ty: r.height / 2 + v.scale * 8 * c.position.y })
    return { x: r.left + r.width / 2 + 2, y: r.top + r.height / 2 }
  })
  await page.waitForTimeout(300)
  // A string, so the bundler adds no helpers to code that runs in the page.
  await page.evaluate(`(() => {
    window.__frames = []; let last = performance.now(); window.__recording = true
    function tick(t) { window.__frames.push(t - last); last = t; if (window.__recording) requestAnimationFrame(tick) }
    requestAnimationFrame(tick)
  })()`)
  await page.mouse.move(target.x, target.y)
  await page.mouse.down()
  const t0 = Date.now()
  let i = 0
  while (Date.now() - t0 < 2000) { i++; await page.mouse.move(target.x + 60 * Math.sin(i / 10), target.y + 40 * Math.cos(i / 13)) }
  const before = await page.evaluate(() => (window as any).__dwEditor.live.value.at)
  await page.evaluate(() => { (window as any).__release = performance.now() })
  await page.mouse.up()
  await page.waitForFunction((b) => (window as any).__dwEditor.live.value.at > b, before, { timeout: 10_000 })
  const release = await page.evaluate(() => (window as any).__dwEditor.live.value.at - (window as any).__release)
  const frames: number[] = await page.evaluate(() => { (window as any).__recording = false; return (window as any).__frames.slice(2) })
  const moves = i
  // Four more drags of half a second, each released and timed the same way, for the spread.
  const releases = [release]
  for (let k = 0; k < 4; k++) {
    await page.mouse.move(target.x, target.y)
    await page.mouse.down()
    const t1 = Date.now()
    while (Date.now() - t1 < 500) { i++; await page.mouse.move(target.x + 60 * Math.sin(i / 10), target.y + 40 * Math.cos(i / 13)) }
    const b = await page.evaluate(() => (window as any).__dwEditor.live.value.at)
    await page.evaluate(() => { (window as any).__release = performance.now() })
    await page.mouse.up()
    await page.waitForFunction((x) => (window as any).__dwEditor.live.value.at > x, b, { timeout: 10_000 })
    releases.push(await page.evaluate(() => (window as any).__dwEditor.live.value.at - (window as any).__release))
    await page.waitForTimeout(200)
  }
  const med = pct(frames, 0.5)
  const p95 = pct(frames, 0.95)
  console.log(`512-nozzle chip (${document.components.length} components, ${document.channels.length} channels), Chromium headless, ${moves} pointer moves in 2 s`)
  console.log(`time to interactive:          ${tti.toFixed(0)} ms   (target < 2000: ${tti < 2000 ? 'met' : 'MISSED'}; canvas drawn ${mounted.toFixed(0)} ms, first forecast ${firstForecast.toFixed(0)} ms)`)
  console.log(`drag frame time median / p95: ${med.toFixed(1)} / ${p95.toFixed(1)} ms over ${frames.length} frames   (target p95 < 20: ${p95 < 20 ? 'met' : 'MISSED'})`)
  console.log(`release → forecast labels:    ${release.toFixed(0)} ms first drag   (target < 100: ${release < 100 ? 'met' : 'MISSED'}); median of ${releases.length} drags ${pct(releases, 0.5).toFixed(0)} ms, slowest ${Math.max(...releases).toFixed(0)} ms`)
} finally {
  await browser.close()
  server.kill('SIGTERM')
}
