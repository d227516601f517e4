import type { ChipDocument } from '#shared/schemas/chip'
import { requireChipDocument } from '#shared/schemas/chip'
import { rectResistancePerViscosity, sizeManifold } from './resistance'
import { bankElements } from './bank'

export interface ParallelChipOptions {
  /** Total number of step nozzles. */
  nozzles: number
  /** Nozzles per ladder (bank); banks sit side by side, each with its own three ports. Default 128. */
  nozzlesPerBank?: number
  name?: string
  /** Nozzle pitch, width, effective (shallow) length and depth, µm. */
  pitch?: number
  nozzleWidth?: number
  nozzleLength?: number
  nozzleDepth?: number
  /** Depth of the deep layer (supply manifold, reservoir, ports), µm. */
  deepDepth?: number
  reservoirWidth?: number
  /** Largest acceptable first-order flow non-uniformity across a bank (default 0.01 = 1 %). */
  targetNonUniformity?: number
  maxManifoldWidth?: number
}

export interface ParallelChipPlan {
  document: ChipDocument
  banks: number
  manifold: { width: number; nonUniformity: number; target: number }
}

/** Plans a chip of parallel step nozzles on ladder manifolds and sizes the supply manifold (see resistance.ts). */
export function planParallelChip(opts: ParallelChipOptions): ParallelChipPlan {
  const n = Math.floor(opts.nozzles)
  if (!(n >= 1)) throw new RangeError(`Nozzle count must be a whole number ≥ 1 (got ${opts.nozzles})`)
  const perBank = Math.max(1, Math.floor(opts.nozzlesPerBank ?? 128))
  const p = {
    pitch: opts.pitch ?? 60, nozzleWidth: opts.nozzleWidth ?? 30, nozzleLength: opts.nozzleLength ?? 150,
    nozzleDepth: opts.nozzleDepth ?? 8, deepDepth: opts.deepDepth ?? 150, reservoirWidth: opts.reservoirWidth ?? 400,
  }
  const target = opts.targetNonUniformity ?? 0.01
  const largestBank = Math.min(n, perBank)
  const manifold = sizeManifold({
    nozzle: rectResistancePerViscosity(p.nozzleWidth, p.nozzleDepth, p.nozzleLength),
    n: largestBank, depth: p.deepDepth, segmentLength: p.pitch, target,
    minWidth: Math.max(100, 2 * p.nozzleWidth), maxWidth: opts.maxManifoldWidth ?? 1500,
  })
  const banks = Math.ceil(n / perBank)
  const bankSpan = p.nozzleLength + manifold.width / 2 + p.reservoirWidth / 2 + 4000
  const parts = Array.from({ length: banks }, (_, b) =>
    bankElements({ ...p, bank: b, x0: 3000 + b * bankSpan, y0: 3000, count: Math.min(perBank, n - b * perBank), manifoldWidth: manifold.width }))

  const ports = parts.flatMap((x) => x.ports)
  const xs = ports.map((q) => q.position.x)
  const ys = ports.map((q) => q.position.y)
  const margin = 2000
  const x0 = Math.min(...xs) - margin
  const y0 = Math.min(...ys) - margin
  const width = Math.max(...xs) + margin - x0
  const height = Math.max(...ys) + margin - y0
  const mark = (id: string, x: number, y: number) =>
    ({ id, kind: 'cross' as const, position: { x, y }, size: 400, lineWidth: 40, layerIds: ['nozzle', 'deep'] })

  const document = requireChipDocument({
    version: 1,
    name: opts.name ?? `Parallel step emulsifier, ${n} nozzles`,
    units: 'um',
    layers: [
      { id: 'nozzle', name: 'Nozzles (shallow)', depth: p.nozzleDepth },
      { id: 'deep', name: 'Manifolds and reservoirs (deep)', depth: p.deepDepth },
    ],
    ports,
    components: parts.flatMap((x) => x.components),
    channels: parts.flatMap((x) => x.channels),
    outline: { kind: 'rectangle', corner: { x: x0, y: y0 }, width, height },
    marks: [
      mark('align-a', x0 + 700, y0 + 700), mark('align-b', x0 + width - 700, y0 + height - 700),
      { id: 'label', kind: 'text', position: { x: x0 + 1500, y: y0 + 500 }, text: `DW step array ${n}`, height: 300, layerIds: [] },
    ],
    operatingPoints: [{
      id: 'op-1', name: 'Design point', temperatureC: 20,
      continuousLiquid: { name: 'hydrofluoroether oil', viscosityMPaS: 1.2, densityKgPerM3: 1600 },
      dispersedLiquid: { liquid: 'water' },
      inlets: parts.flatMap((x) => x.inlets),
    }],
    activeOperatingPoint: 'op-1',
  })
  return { document, banks, manifold: { ...manifold, target } }
}

/** A valid chip document with `nozzles` parallel step nozzles on sized ladder manifolds. */
export function generateParallelChip(opts: ParallelChipOptions): ChipDocument {
  return planParallelChip(opts).document
}
