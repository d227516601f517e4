// Side-by-side merge benchmark against KLayout's C++ engine (part of `npm run bench`). Exports the raw, unmerged
// pieces of the 512-, 4,096- and 16,384-nozzle chips on the 1 nm database grid, lets `klayout -b` merge them
// per layer (median of three, merge only, excluding load; scripts/bench/klayout-merge.py), times our merge of
// the same pieces the same way and prints both, their ratio against the target (≤ 3× at 4,096 and 16,384) and
// whether the merged areas agree per layer (1e-6 relative); then reads our DXFs of the 512- and 4,096-nozzle
// chips in KLayout and checks the filled area per layer (1e-6). Skipped with a printed line when klayout is absent.
import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { multiPolygonArea } from '~~/geometry/area'
import { planParallelChip } from '~~/geometry/arrays'
import { documentPieces } from '~~/geometry/outlines/elements'
import { buildOutlines } from '~~/geometry/outlines'
import { exportDxf } from '~~/geometry/dxf'
import { depthLayerName } from '~~/geometry/dxf/layer-names'
import type { Polygon } from '~~/geometry/types'
import { DBU_PER_UM, toDbu } from '~~/geometry/units'
import { importShipped } from './shipped'
import { median } from './timing'

const KLAYOUT = process.env.KLAYOUT ?? '/usr/bin/klayout'
const SCRIPT = fileURLToPath(new URL('./klayout-merge.py', import.meta.url))
const DXF_SCRIPT = fileURLToPath(new URL('./klayout-dxf.py', import.meta.url))
const SIZES = [512, 4096, 16384]
const TARGET = 3

/** Raw pieces per layer of the generated chip (16,384 is over one saved design's piece limit: `unbounded`). */
export function rawPieces(nozzles: number): Map<string, Polygon[]> {
  const doc = planParallelChip({ nozzles, unbounded: true }).document
  const byLayer = new Map<string, Polygon[]>()
  for (const e of documentPieces(doc, 0.1).elements) {
    const list = byLayer.get(e.layerId) ?? []
    list.push(...e.pieces)
    byLayer.set(e.layerId, list)
  }
  return byLayer
}

function exportPieces(layers: Map<string, Polygon[]>): string {
  const lines: string[] = []
  for (const [layer, pieces] of layers) {
    for (const p of pieces) lines.push(`${layer} ${p[0]!.map(([x, y]) => `${toDbu(x)} ${toDbu(y)}`).join(' ')}`)
  }
  return lines.join('\n') + '\n'
}

export interface KLayoutMerge {
  ms: number
  areas: Map<string, number>
}

/** Runs KLayout's merge on the pieces; areas in µm². */
export function klayoutMerge(layers: Map<string, Polygon[]>): KLayoutMerge {
  const dir = mkdtempSync(join(tmpdir(), 'dw-klayout-'))
  try {
    const input = join(dir, 'pieces.txt')
    const output = join(dir, 'merged.txt')
    writeFileSync(input, exportPieces(layers))
    execFileSync(KLAYOUT, ['-b', '-r', SCRIPT, '-rd', `input=${input}`, '-rd', `output=${output}`], {
      stdio: ['ignore', 'ignore', 'inherit'],
      timeout: 600_000,
    })
    const areas = new Map<string, number>()
    let ms = NaN
    for (const line of readFileSync(output, 'utf8').trim().split('\n')) {
      const [name, value] = line.split(' ')
      if (name === 'merge_ms') ms = Number(value)
      else areas.set(name!, Number(value) / DBU_PER_UM ** 2)
    }
    return { ms, areas }
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

/** KLayout's even-odd fill of every layer of a DXF we wrote: area µm² and parts per layer name. */
export function klayoutDxfAreas(dxf: string): Map<string, { area: number; parts: number }> {
  const dir = mkdtempSync(join(tmpdir(), 'dw-klayout-'))
  try {
    const input = join(dir, 'mask.dxf')
    const output = join(dir, 'areas.txt')
    writeFileSync(input, dxf)
    execFileSync(KLAYOUT, ['-b', '-r', DXF_SCRIPT, '-rd', `input=${input}`, '-rd', `output=${output}`], {
      stdio: ['ignore', 'ignore', 'inherit'],
      timeout: 600_000,
    })
    const areas = new Map<string, { area: number; parts: number }>()
    for (const line of readFileSync(output, 'utf8').trim().split('\n')) {
      const [name, area, parts] = line.split(' ')
      areas.set(name!, { area: Number(area), parts: Number(parts) })
    }
    return areas
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

/** Our DXFs of the 512- and 4,096-nozzle chips read and filled by KLayout: the same area per depth layer. */
function dxfCheck(): void {
  for (const n of [512, 4096]) {
    const doc = planParallelChip({ nozzles: n }).document
    const o = buildOutlines(doc)
    const k = klayoutDxfAreas(exportDxf(doc, { outlines: o, date: '2026-01-01' }))
    let worst = 0
    const names: string[] = []
    for (const l of o.layers) {
      const name = depthLayerName(l.depth)
      const ours = multiPolygonArea(l.polygons)
      const theirs = k.get(name)?.area ?? NaN
      worst = Math.max(worst, Math.abs(ours - theirs) / ours)
      names.push(name)
    }
    console.log(
      `  DXF of ${n} nozzles read by KLayout (${names.join(', ')}): areas per layer agree to ${worst.toExponential(1)} relative (check ≤ 1e-6: ${worst <= 1e-6 ? 'ok' : 'FAILED'})`,
    )
  }
}

export async function run(): Promise<void> {
  if (!existsSync(KLAYOUT)) {
    console.log(`klayout: not installed at ${KLAYOUT} — side-by-side merge benchmark skipped (apt-get install klayout)`)
    return
  }
  console.log(
    'klayout: merge of the same raw pieces, median of three, merge only (load excluded); ours as shipped (an esbuild bundle)',
  )
  const { mergePieces } = await importShipped<typeof import('./core')>('scripts/bench/core.ts')
  // Warm-up: a one-run warm-up leaves Clipper2's code unoptimised for the first size (512 read 5× slow).
  const warm = rawPieces(512)
  for (let i = 0; i < 5; i++) for (const pieces of warm.values()) mergePieces(pieces)
  for (const n of SIZES) {
    const layers = rawPieces(n)
    const k = klayoutMerge(layers)
    const ours = median(() => {
      for (const pieces of layers.values()) mergePieces(pieces)
    }, 3)
    let worst = 0
    for (const [layer, pieces] of layers) {
      const a = multiPolygonArea(mergePieces(pieces).merged)
      const b = k.areas.get(layer) ?? NaN
      worst = Math.max(worst, Math.abs(a - b) / Math.max(a, b))
    }
    const ratio = ours / k.ms
    const target = n >= 4096 ? ` (target ≤ ${TARGET}×: ${ratio <= TARGET ? 'met' : 'MISSED'})` : ''
    console.log(
      `  merge ${n} nozzles: ours ${ours.toFixed(1)} ms, KLayout ${k.ms.toFixed(1)} ms, ratio ${ratio.toFixed(1)}×${target};` +
        ` areas per layer agree to ${worst.toExponential(1)} relative (check ≤ 1e-6: ${worst <= 1e-6 ? 'ok' : 'FAILED'})`,
    )
  }
  dxfCheck()
}

if (import.meta.url === `file://${globalThis.process.argv[1]}`) await run()
