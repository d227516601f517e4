// Benchmarks of the forecast core: median times and growth ratios, printed. Not a test.
import { generateParallelChip } from '../../geometry/arrays'
import { parseChipDocument, type ChipDocument } from '../../shared/schemas/chip'
import { forecastDocument } from '../../shared/physics/document'
import { solveNetwork, solveNetworkDense, type NetworkProblem } from '../../shared/physics/network'
import { assemble } from '../../shared/physics/network/assemble'
import { indexNetwork } from '../../shared/physics/network/indexing'
import { jacobi, pcg } from '../../shared/physics/network/pcg'
import { runForecast } from '../../shared/physics/forecast'
import { forecastJunction } from '../../shared/physics/forecast/junction'
import { resolveJunctionRequest } from '../../shared/physics/forecast/junctionRequest'
import { junctionRequest } from '../../shared/schemas/forecast'
import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { solveSystem } from '../../shared/physics/network/solve'
import type { ReducedSystem } from '../../shared/physics/network/assemble'
import { importShipped } from './shipped'
import { median } from './timing'

/** Runs before timing the chip forecasts, so the JIT has compiled the core as it has in a page after a few edits. */
const WARM_UP = 10

const PYTHON = '/usr/bin/python3'
const SCIPY_SCRIPT = join(import.meta.dirname, 'scipy_spsolve.py')

/** The reduced system as a full symmetric CSR (diagonal merged into each row), then our answer, for scipy_spsolve.py. */
function writeSystem(path: string, system: ReducedSystem, ours: Float64Array): void {
  const { size, rowStart, column, value, diagonal } = system.matrix
  const nnz = rowStart[size]! + size
  const indptr = new Int32Array(size + 1)
  const indices = new Int32Array(nnz)
  const data = new Float64Array(nnz)
  let e = 0
  for (let i = 0; i < size; i++) {
    indptr[i] = e
    ;((indices[e] = i), (data[e++] = diagonal[i]!))
    for (let k = rowStart[i]!; k < rowStart[i + 1]!; k++) ((indices[e] = column[k]!), (data[e++] = value[k]!))
  }
  indptr[size] = e
  const ints = 2 + (size + 1) + nnz
  const pad = (ints * 4) % 8
  const buffer = Buffer.alloc(ints * 4 + pad + 8 * (nnz + 2 * size))
  buffer.writeInt32LE(size, 0)
  buffer.writeInt32LE(nnz, 4)
  Buffer.from(indptr.buffer).copy(buffer, 8)
  Buffer.from(indices.buffer).copy(buffer, 8 + 4 * (size + 1))
  let at = ints * 4 + pad
  for (const part of [data, system.rhs, ours])
    (Buffer.from(part.buffer, part.byteOffset, part.byteLength).copy(buffer, at), (at += part.byteLength))
  writeFileSync(path, buffer)
}

function hasScipy(): boolean {
  if (!existsSync(PYTHON)) return false
  try {
    execFileSync(PYTHON, ['-c', 'import scipy.sparse.linalg'], { stdio: 'ignore' })
    return true
  } catch {
    return false
  }
}

/** `network N channels (ladder|grid): ours X ms, SciPy Y ms, ratio Z×` — the same assembled system, median of each. */
function scipySideBySide(): void {
  console.log(
    '\n# physics — network solve side by side with SciPy (scipy.sparse.linalg.spsolve, SuperLU), same system, median ms',
  )
  if (!hasScipy()) {
    console.log(
      `SciPy not found (${PYTHON} with scipy): side-by-side lines skipped; apt-get install python3-scipy to see them`,
    )
    return
  }
  const folder = mkdtempSync(join(tmpdir(), 'dw-scipy-'))
  try {
    for (const [kind, build] of [
      ['ladder', ladder],
      ['grid', grid],
    ] as const) {
      for (const size of [10_000, 100_000]) {
        const problem = build(size)
        const system = assemble(indexNetwork(problem))
        const { x, solver } = solveSystem(system)
        const repeats = size >= 100_000 ? 5 : 9
        const ours = median(() => solveSystem(system), repeats)
        const whole = median(() => solveNetwork(problem), 3)
        const path = join(folder, `${kind}-${size}.bin`)
        writeSystem(path, system, x)
        const theirs = JSON.parse(
          execFileSync(PYTHON, [SCIPY_SCRIPT, path, String(repeats)], { encoding: 'utf8' }),
        ) as { median: number; difference: number }
        const ratio = ours / theirs.median
        console.log(
          `network ${problem.channels.length} channels (${kind}): ours ${ours.toFixed(1)} ms, SciPy ${theirs.median.toFixed(1)} ms, ratio ${ratio.toFixed(2)}×${size === 100_000 ? (ratio <= 3 ? '  (target ≤ 3×: met)' : '  (target ≤ 3×: NOT met)') : ''}`,
        )
        console.log(
          `  ${solver}; answers differ by ${theirs.difference.toExponential(1)} (max-norm, relative); whole solveNetwork incl. naming nodes and flows ${whole.toFixed(1)} ms`,
        )
      }
    }
  } finally {
    rmSync(folder, { recursive: true, force: true })
  }
}

/** Parallel-nozzle ladder with `channels` channels: feed rail, collector rail, nozzles between them. */
function ladder(channels: number): NetworkProblem {
  const rungs = Math.floor(channels / 3)
  const list = []
  for (let i = 0; i < rungs; i++) {
    list.push({ id: `f${i}`, from: `A${i}`, to: `A${i + 1}`, resistance: 1e10 })
    list.push({ id: `c${i}`, from: `B${i}`, to: `B${i + 1}`, resistance: 1e10 })
    list.push({ id: `n${i}`, from: `A${i + 1}`, to: `B${i + 1}`, resistance: 1e13 })
  }
  return {
    channels: list,
    sources: [
      { node: 'A0', flow: 1e-9 },
      { node: `B${rungs}`, pressure: 0 },
    ],
  }
}

/** Square grid with about `channels` channels (2n(n − 1) ≈ channels). */
function grid(channels: number): NetworkProblem {
  const n = Math.round(Math.sqrt(channels / 2)) + 1
  const list = []
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      if (i + 1 < n)
        list.push({
          id: `h${i}.${j}`,
          from: `${i}.${j}`,
          to: `${i + 1}.${j}`,
          resistance: 1e9 * (1 + ((7 * i + 3 * j) % 5)),
        })
      if (j + 1 < n)
        list.push({
          id: `v${i}.${j}`,
          from: `${i}.${j}`,
          to: `${i}.${j + 1}`,
          resistance: 1e9 * (1 + ((3 * i + 5 * j) % 7)),
        })
    }
  return {
    channels: list,
    sources: [
      { node: '0.0', pressure: 1000 },
      { node: `${n - 1}.${n - 1}`, pressure: 0 },
    ],
  }
}

/** 512-nozzle step-emulsification chip: oil and water feed rails, 512 nozzles into a collection channel. */
function parallelChipRequest(nozzles: number) {
  const channels = []
  const um = (x: number) => `${x} um`
  for (let i = 0; i < nozzles; i++) {
    channels.push({
      id: `water-rail-${i}`,
      from: `w${i}`,
      to: `w${i + 1}`,
      width: um(400),
      depth: um(50),
      length: um(100),
    })
    channels.push({
      id: `nozzle-${i}`,
      from: `w${i + 1}`,
      to: `out${i + 1}`,
      width: um(40),
      depth: um(10),
      length: um(300),
    })
    channels.push({
      id: `collector-${i}`,
      from: `out${i}`,
      to: `out${i + 1}`,
      width: um(1000),
      depth: um(200),
      length: um(100),
    })
  }
  return {
    network: {
      channels,
      sources: [
        { node: 'w0', flow: '20 uL/min' },
        { node: `out${nozzles}`, pressure: 0 },
      ],
      liquid: { liquid: 'water' },
      parallelSets: [channels.filter(c => c.id.startsWith('nozzle-')).map(c => c.id)],
      limits: { bondPressure: '2 bar', pumpPressure: '1 bar' },
    },
  }
}

/** Network solves at growing sizes (ladders to 1M channels) and the SciPy side-by-side lines. */
export function networkBench(): void {
  console.log('\n# physics — network solves (median ms)')
  for (const [name, build] of [
    ['ladder', ladder],
    ['square grid', grid],
  ] as const) {
    const times: number[] = []
    const matrixTimes: number[] = []
    const sizes = name === 'ladder' ? [1_000, 10_000, 100_000, 1_000_000] : [1_000, 10_000, 100_000]
    for (const size of sizes) {
      const problem = build(size)
      const solution = solveNetwork(problem)
      const repeats = size >= 1_000_000 ? 3 : size >= 100_000 ? 5 : 9
      const t = median(() => solveNetwork(problem), repeats)
      const system = assemble(indexNetwork(problem))
      const matrix = median(() => solveSystem(system), repeats)
      times.push(t)
      matrixTimes.push(matrix)
      console.log(
        `${name.padEnd(12)} ${String(problem.channels.length).padStart(7)} channels  ${t.toFixed(1).padStart(8)} ms  (matrix part ${matrix.toFixed(1)} ms)  ${solution.solver}, ${solution.iterations} iterations`,
      )
    }
    const growth = times
      .slice(1)
      .map((t, k) => `${(t / times[k]!).toFixed(1)}× (${['1k→10k', '10k→100k', '100k→1M'][k]})`)
    const matrixGrowth = matrixTimes.slice(1).map((t, k) => `${(t / matrixTimes[k]!).toFixed(1)}×`)
    console.log(`${name.padEnd(12)} growth per 10×: ${growth.join(', ')}; matrix part ${matrixGrowth.join(', ')}`)
  }
  scipySideBySide()
}

export async function run(): Promise<void> {
  networkBench()
  // The grid's previous preconditioner, for comparison (100k skipped: ~4.5 s per solve).
  for (const size of [1_000, 10_000]) {
    const { matrix, rhs } = assemble(indexNetwork(grid(size)))
    let iterations = 0
    const t = median(() => (iterations = pcg(matrix, rhs, jacobi(matrix)).iterations), 3)
    console.log(
      `grid, Jacobi ${String(size).padStart(7)} channels  ${t.toFixed(1).padStart(8)} ms  (PCG iterations only, ${iterations} iterations)`,
    )
  }

  // Dense Gaussian elimination needs n² doubles: 10k channels ≈ 6.7k unknowns ≈ 360 MB and ~10¹¹ flops,
  // so it runs at sizes that fit and is extrapolated to 10k by n³.
  const sparse10k = median(() => solveNetwork(ladder(10_000)), 7)
  const denseSizes = [600, 1_200, 2_400]
  let last = { unknowns: 0, ms: 0 }
  for (const size of denseSizes) {
    const problem = ladder(size)
    const ms = median(() => solveNetworkDense(problem), 3)
    last = { unknowns: 2 * Math.floor(size / 3), ms }
    console.log(`dense Gauss  ${String(problem.channels.length).padStart(7)} channels  ${ms.toFixed(1).padStart(8)} ms`)
  }
  const unknowns10k = 2 * Math.floor(10_000 / 3)
  const extrapolated = last.ms * (unknowns10k / last.unknowns) ** 3
  console.log(
    `dense at 10k channels (extrapolated by n³ from ${denseSizes.at(-1)}): ~${(extrapolated / 1000).toFixed(1)} s; sparse ${sparse10k.toFixed(1)} ms → dense/sparse ≈ ${Math.round(extrapolated / sparse10k)}×`,
  )

  console.log('\n# physics — 512-nozzle generated chip document (geometry/arrays), forecastDocument')
  const generated = generateParallelChip({ nozzles: 512 })
  // The generator's operating point has no interfacial tension (its oil is given by properties, so the library
  // has no pair): give one, or every junction would be skipped with a warning and the figure would flatter us.
  const chip: ChipDocument = {
    ...generated,
    operatingPoints: generated.operatingPoints.map(op => ({
      ...op,
      interfacialTensionMNPerM: 3,
      contactAngleDeg: 150,
    })),
  }
  const answer = forecastDocument(chip)
  const forecast = answer.junctions.filter(j => j.forecast).length
  // The figure is the core as shipped (an esbuild bundle), warmed up as the editor's worker is after a few edits.
  const shipped = (await importShipped<typeof import('./core')>('scripts/bench/core.ts')).forecastDocument
  for (let i = 0; i < WARM_UP; i++) shipped(chip)
  const docMs = median(() => shipped(chip), 21)
  // On a shared machine the wall-clock median counts time other processes held the core: CPU time per run too.
  const cpuStart = process.cpuUsage()
  for (let i = 0; i < 21; i++) shipped(chip)
  const cpuUsed = process.cpuUsage(cpuStart)
  const docCpuMs = (cpuUsed.user + cpuUsed.system) / 1000 / 21
  for (let i = 0; i < WARM_UP; i++) forecastDocument(chip)
  const tsxMs = median(() => forecastDocument(chip), 21)
  const json = JSON.parse(JSON.stringify(chip))
  const parseMs = median(() => parseChipDocument(json), 7)
  const { coupling } = answer.network
  const windows = answer.network.operatingWindow
  console.log(
    `forecastDocument, two-phase: ${answer.network.channels.length} channels, ${answer.junctions.length} junctions (${forecast} forecast), ${answer.network.solver.name}: ${docMs.toFixed(2)} ms median, ${docCpuMs.toFixed(2)} ms CPU per run (target < 20 ms: ${docMs < 20 ? 'met' : docCpuMs < 20 ? 'met in CPU time only' : 'NOT met'})`,
  )
  console.log(
    `  coupled drops–flows iteration: ${coupling.iterations} iterations, ${coupling.converged ? 'converged' : 'NOT converged'} (change ${coupling.change.toExponential(2)} < tolerance ${coupling.tolerance}); ${windows.length} pressure windows, e.g. ${windows[0] ? `${windows[0].port} ${(windows[0].from.value / 100).toFixed(1)}–${(windows[0].to.value / 100).toFixed(1)} mbar (${windows[0].limitedBy})` : 'none'}`,
  )
  const dropShare = answer.network.channels.reduce((max, c) => Math.max(max, c.dropletShare), 0)
  console.log(`  largest share of a channel's pressure drop added by drops: ${(100 * dropShare).toFixed(2)} %`)
  console.log(
    `uniformity across ${answer.network.uniformity[0]?.count} nozzles: cv ${(answer.network.uniformity[0]?.cv ?? 0).toExponential(2)}, max/min ${(answer.network.uniformity[0]?.maxOverMin ?? 1).toFixed(4)}`,
  )
  console.log(
    `(parsing the same document from JSON, as runDocumentForecast does first: ${parseMs.toFixed(2)} ms median; the same forecast under the tsx loader, whose keepNames wrappers do not ship: ${tsxMs.toFixed(2)} ms)`,
  )

  console.log(
    '\n# physics — 512-nozzle network built by hand (network request + 512 junction forecasts), for comparison',
  )
  const request = parallelChipRequest(512)
  const junction = junctionRequest.parse({
    junction: { kind: 'step', mainWidth: '40 um', depth: '10 um' },
    continuous: { liquid: 'hydrofluoroether' },
    dispersed: { liquid: 'water' },
    surfactant: 'fluorinated-block-copolymer',
    contactAngle: '150 deg',
    flow: { continuous: '50 uL/min', dispersed: '20 uL/min' },
  })
  const full = () => {
    const network = runForecast(request) as { channels: { id: string; flow: { value: number } }[] }
    const { junction: base, warnings } = resolveJunctionRequest(junction)
    for (const channel of network.channels) {
      if (channel.id.startsWith('nozzle-'))
        forecastJunction({ ...base, flowDispersed: Math.abs(channel.flow.value) }, warnings)
    }
  }
  const ms = median(full, 15)
  console.log(
    `single-phase path — network (1536 channels, one liquid) + 512 nozzle forecasts: ${ms.toFixed(2)} ms median (target < 20 ms)`,
  )
}
