// Geometry benchmark (part of `npm run bench`): outline + merge, design rules and DXF for the generated
// 512- and 4,096-nozzle chips; the clustered merge against one polygon-clipping sweep per layer; the
// spatial-index rule check against the naive all-pairs check; growth per 8×; chip sizes and wafers; the largest
// document the schema accepts and what its summary and DXF take.
import { multiPolygonArea } from '~~/geometry/area'
import { planParallelChip, planTJunctionChip } from '~~/geometry/arrays'
import { BUILT_IN_PROCESSES } from '~~/geometry/rules'
import { documentPieceCount, parseChipDocument } from '~~/shared/schemas/chip'
import { summarizeRevision } from '~~/server/services/revisionSummary'
import { maskFile } from '~~/server/services/mask'
import { largestAcceptedDocument } from '~~/tests/unit/schemas/largest'
import { counted } from '~~/shared/utils/counted'
import { importShipped } from './shipped'
import { timed } from './timing'

const mm = (um: number) => (um / 1000).toFixed(1)

export async function run(): Promise<void> {
  const process = BUILT_IN_PROCESSES[0]!
  // Timed as shipped: the server's geometry worker is an esbuild bundle (scripts/bench/shipped.ts).
  const { buildOutlines, checkDesignRules, exportDxf, mergePiecesSingleSweep } =
    await importShipped<typeof import('./core')>('scripts/bench/core.ts')
  const rows: { n: number; outline: number; rules: number; dxf: number }[] = []
  console.log('geometry: parallel step-nozzle chips (median of runs, ms; the core as shipped, an esbuild bundle)')
  // Warm-up pass so the 512 figures are not the JIT's first compile (that would flatter the growth ratio).
  for (let i = 0; i < 3; i++) {
    const w = planParallelChip({ nozzles: 512 }).document
    const wo = buildOutlines(w)
    checkDesignRules(w, process, { outlines: wo })
    exportDxf(w, { outlines: wo, date: '2026-01-01' })
  }
  for (const n of [512, 4096]) {
    const runs = n <= 512 ? 9 : 5
    const plan = planParallelChip({ nozzles: n })
    const doc = plan.document
    const outline = timed(() => buildOutlines(doc), runs)
    const rules = timed(() => checkDesignRules(doc, process, { outlines: outline.value }), runs)
    const dxf = timed(() => exportDxf(doc, { outlines: outline.value, date: '2026-01-01' }), runs)
    rows.push({ n, outline: outline.median, rules: rules.median, dxf: dxf.median })
    const total = outline.median + rules.median + dxf.median
    const errors = rules.value.filter(f => f.severity === 'error').length
    console.log(
      `  ${n} nozzles: outline+merge ${outline.median.toFixed(1)}, rules ${rules.median.toFixed(1)}, DXF ${dxf.median.toFixed(1)}` +
        ` → total ${total.toFixed(1)} ms${n === 512 ? ` (target < 1000: ${total < 1000 ? 'met' : 'MISSED'})` : ''}` +
        `; ${counted(rules.value.length, 'finding', 'findings')} (${counted(errors, 'error', 'errors')}), ${(dxf.value.length / 1e6).toFixed(2)} MB DXF`,
    )
    console.log(
      `    chip ${mm(plan.chip.width)} × ${mm(plan.chip.height)} mm, ${plan.chip.columns} × ${plan.chip.rows} banks,` +
        ` diagonal ${plan.chip.wafer.diagonalMm.toFixed(1)} mm → ${plan.chip.wafer.diameterMm ?? '> 300'} mm wafer`,
    )
    // The plain way for comparison: one sweep per layer over every piece (one run; it is the slow one).
    let sweepMs = 0
    let same = true
    for (const l of outline.value.layers) {
      const pieces = outline.value.elements.filter(e => e.layerId === l.layerId).flatMap(e => e.pieces)
      const t = performance.now()
      const single = mergePiecesSingleSweep(pieces)
      sweepMs += performance.now() - t
      const a = multiPolygonArea(l.polygons)
      same &&= Math.abs(a - multiPolygonArea(single)) <= 1e-6 * a && single.length === l.polygons.length
    }
    console.log(
      `    merge alone: one sweep per layer ${sweepMs.toFixed(1)} ms (previous engine, polygon-clipping: same area within 1e-6 and parts: ${same})`,
    )
  }
  const doc = planParallelChip({ nozzles: 512 }).document
  const o = buildOutlines(doc)
  const indexed = timed(() => checkDesignRules(doc, process, { outlines: o }), 3)
  const naive = timed(() => checkDesignRules(doc, process, { outlines: o, naive: true }), 1)
  const same = JSON.stringify(indexed.value) === JSON.stringify(naive.value)
  console.log(
    `  512 nozzles rules: flatbush ${indexed.median.toFixed(1)} ms vs naive all-pairs ${naive.median.toFixed(1)} ms → ${(naive.median / indexed.median).toFixed(1)}× faster (same findings: ${same})`,
  )
  const [a, b] = rows
  if (a && b) {
    const nlogn = (8 * Math.log(b.n)) / Math.log(a.n)
    const g = (x: number, y: number) => (y / x).toFixed(1)
    console.log(
      `  growth per 8× nozzles (512 → 4,096): outline+merge ${g(a.outline, b.outline)}×, rules ${g(a.rules, b.rules)}×, DXF ${g(a.dxf, b.dxf)}×,` +
        ` total ${g(a.outline + a.rules + a.dxf, b.outline + b.rules + b.dxf)}× (n log n would be ${nlogn.toFixed(1)}×)`,
    )
  }
  // 16,384 nozzles is over one saved design's piece limit; the plan is built `unbounded` to measure the engine.
  const big = planParallelChip({ nozzles: 16384, unbounded: true }).document
  const whole = timed(() => {
    const bo = buildOutlines(big)
    checkDesignRules(big, process, { outlines: bo })
    return exportDxf(big, { outlines: bo, date: '2026-01-01' }).length
  }, 3)
  console.log(
    `  outline + rules + DXF of 16,384 nozzles: ${whole.median.toFixed(0)} ms (target < 2 s: ${whole.median < 2000 ? 'met' : 'MISSED'}), ${(whole.value / 1e6).toFixed(1)} MB DXF`,
  )
  const tj = planTJunctionChip({ junctions: 64 })
  const tjRules = timed(() => checkDesignRules(tj.document, process), 3)
  console.log(
    `  64 T-junctions: outline+rules ${tjRules.median.toFixed(1)} ms, ${tjRules.value.filter(f => f.severity !== 'info').length} errors/warnings;` +
      ` chip ${mm(tj.chip.width)} × ${mm(tj.chip.height)} mm (${tj.chip.wafer.diameterMm ?? '> 300'} mm wafer);` +
      ` manifolds ${tj.continuous.width}/${tj.dispersed.width} µm, non-uniformity ${(100 * tj.continuous.nonUniformity).toFixed(2)}/${(100 * tj.dispersed.nonUniformity).toFixed(2)} %`,
  )
  largest()
}

/** The largest document the schema accepts (tests/unit/schemas/largest.ts): what one save or DXF can cost. */
function largest(): void {
  const raw = largestAcceptedDocument()
  const parsed = parseChipDocument(raw)
  if (!parsed.ok) throw new Error(`largest accepted document refused: ${parsed.errors[0]?.message}`)
  const doc = parsed.document
  const nozzles = doc.components.reduce((n, c) => n + (c.kind === 'step-array' ? c.nozzleCount : 0), 0)
  let t = performance.now()
  summarizeRevision(doc, BUILT_IN_PROCESSES[0]!.id)
  const summaryMs = performance.now() - t
  t = performance.now()
  const mask = maskFile({ document: doc, number: 1, createdAt: '2026-01-01', designName: doc.name, mirror: false })
  const dxfMs = performance.now() - t
  console.log(
    `  largest accepted document: ${(JSON.stringify(raw).length / 1024).toFixed(1)} KiB, ${nozzles.toLocaleString('en-US')} nozzles,` +
      ` ${documentPieceCount(doc).toLocaleString('en-US')} pieces (its JSON is tiny; the cost is the pieces) → summary ${(summaryMs / 1000).toFixed(1)} s, DXF ${(dxfMs / 1000).toFixed(1)} s` +
      ` (${mask.ok ? `${(mask.dxf.length / 1e6).toFixed(1)} MB` : mask.message}); both run in a geometry worker with a time budget`,
  )
}

if (import.meta.url === `file://${globalThis.process.argv[1]}`) await run()
