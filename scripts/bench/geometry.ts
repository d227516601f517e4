// Geometry benchmark (part of `npm run bench`): outline + merge, design rules and DXF for the generated
// 512- and 4,096-nozzle chips; the spatial-index rule check against the naive all-pairs check; growth per 8×.
import { generateParallelChip } from '~~/geometry/arrays'
import { exportDxf } from '~~/geometry/dxf'
import { buildOutlines } from '~~/geometry/outlines'
import { BUILT_IN_PROCESSES, checkDesignRules } from '~~/geometry/rules'

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

function time<T>(fn: () => T, runs: number): { ms: number; value: T } {
  let value = fn()
  const ms: number[] = []
  for (let i = 0; i < runs; i++) {
    const t = performance.now()
    value = fn()
    ms.push(performance.now() - t)
  }
  return { ms: median(ms), value }
}

export async function run(): Promise<void> {
  const process = BUILT_IN_PROCESSES[0]!
  const rows: { n: number; outline: number; rules: number; dxf: number }[] = []
  console.log('geometry: parallel step-nozzle chips (median of runs, ms)')
  for (const n of [512, 4096]) {
    const runs = n <= 512 ? 5 : 2
    const doc = generateParallelChip({ nozzles: n })
    const outline = time(() => buildOutlines(doc), runs)
    const rules = time(() => checkDesignRules(doc, process, { outlines: outline.value }), runs)
    const dxf = time(() => exportDxf(doc, { outlines: outline.value, date: '2026-01-01' }), runs)
    rows.push({ n, outline: outline.ms, rules: rules.ms, dxf: dxf.ms })
    const total = outline.ms + rules.ms + dxf.ms
    console.log(`  ${n} nozzles: outline+merge ${outline.ms.toFixed(1)}, rules ${rules.ms.toFixed(1)}, DXF ${dxf.ms.toFixed(1)}` +
      ` → total ${total.toFixed(1)} ms${n === 512 ? ` (target < 1000: ${total < 1000 ? 'met' : 'MISSED'})` : ''}` +
      `; ${rules.value.length} findings, ${(dxf.value.length / 1e6).toFixed(2)} MB DXF`)
  }
  const doc = generateParallelChip({ nozzles: 512 })
  const o = buildOutlines(doc)
  const indexed = time(() => checkDesignRules(doc, process, { outlines: o }), 3)
  const naive = time(() => checkDesignRules(doc, process, { outlines: o, naive: true }), 1)
  const same = JSON.stringify(indexed.value) === JSON.stringify(naive.value)
  console.log(`  512 nozzles rules: flatbush ${indexed.ms.toFixed(1)} ms vs naive all-pairs ${naive.ms.toFixed(1)} ms → ${(naive.ms / indexed.ms).toFixed(1)}× faster (same findings: ${same})`)
  const [a, b] = rows
  if (a && b) {
    const nlogn = (8 * Math.log(b.n)) / Math.log(a.n)
    const g = (x: number, y: number) => (y / x).toFixed(1)
    console.log(`  growth per 8× nozzles: outline ${g(a.outline, b.outline)}×, rules ${g(a.rules, b.rules)}×, DXF ${g(a.dxf, b.dxf)}× (n log n would be ${nlogn.toFixed(1)}×)`)
  }
}

if (import.meta.url === `file://${globalThis.process.argv[1]}`) await run()
