import type { ChipDocument } from '#shared/schemas/chip'
import { requireChipDocument } from '#shared/schemas/chip'
import { rectResistancePerViscosity, sizeManifold } from './resistance'
import { bankElements } from './bank'
import { designPoint } from './elements'
import { frameChip, gridBanks, waferNote } from './layout'
import type { WaferFit } from './wafer'

export interface ParallelChipOptions {
  /** Total number of step nozzles. */
  nozzles: number
  /** Nozzles per ladder (bank); banks sit on a grid of rows and columns, each with its own three ports. Default 128. */
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
  /**
   * Skip the document's limits (benchmarks only): a 16,384-nozzle chip is over the 40,000 drawn pieces one saved
   * design may have, and the geometry benchmark still measures it. The result is not a valid saved document.
   */
  unbounded?: boolean
}

export interface ParallelChipPlan {
  document: ChipDocument
  banks: number
  manifold: { width: number; nonUniformity: number; target: number }
  /** Chip size (µm), bank grid and the smallest wafer it fits (see wafer.ts). */
  chip: { width: number; height: number; columns: number; rows: number; wafer: WaferFit }
  warnings: string[]
}

/** Plans a chip of parallel step nozzles on ladder manifolds and sizes the supply manifold (see resistance.ts). */
export function planParallelChip(opts: ParallelChipOptions): ParallelChipPlan {
  const n = Math.floor(opts.nozzles)
  if (!(n >= 1)) throw new RangeError(`Nozzle count must be a whole number ≥ 1 (got ${opts.nozzles})`)
  const perBank = Math.max(1, Math.floor(opts.nozzlesPerBank ?? 128))
  const p = {
    pitch: opts.pitch ?? 60,
    nozzleWidth: opts.nozzleWidth ?? 30,
    nozzleLength: opts.nozzleLength ?? 150,
    nozzleDepth: opts.nozzleDepth ?? 8,
    deepDepth: opts.deepDepth ?? 150,
    reservoirWidth: opts.reservoirWidth ?? 400,
  }
  const target = opts.targetNonUniformity ?? 0.01
  const largestBank = Math.min(n, perBank)
  const manifold = sizeManifold({
    nozzle: rectResistancePerViscosity(p.nozzleWidth, p.nozzleDepth, p.nozzleLength),
    n: largestBank,
    depth: p.deepDepth,
    segmentLength: p.pitch,
    target,
    minWidth: Math.max(100, 2 * p.nozzleWidth),
    maxWidth: opts.maxManifoldWidth ?? 1500,
  })
  const banks = Math.ceil(n / perBank)
  const grid = gridBanks(
    Array.from({ length: banks }, (_, b) =>
      bankElements({
        ...p,
        bank: b,
        x0: 0,
        y0: 0,
        count: Math.min(perBank, n - b * perBank),
        manifoldWidth: manifold.width,
      }),
    ),
    0,
  )
  const parts = grid.banks
  const frame = frameChip(parts, 0, `DW step array ${n}`, ['nozzle', 'deep'])
  const { name, warnings } = waferNote(opts.name ?? `Parallel step emulsifier, ${n} nozzles`, frame)

  const raw = {
    version: 1,
    name,
    units: 'um',
    layers: [
      { id: 'nozzle', name: 'Nozzles (shallow)', depth: p.nozzleDepth },
      { id: 'deep', name: 'Manifolds and reservoirs (deep)', depth: p.deepDepth },
    ],
    ports: parts.flatMap(x => x.ports),
    components: parts.flatMap(x => x.components),
    channels: parts.flatMap(x => x.channels),
    outline: frame.outline,
    marks: frame.marks,
    operatingPoints: [designPoint(parts.flatMap(x => x.inlets))],
    activeOperatingPoint: 'op-1',
  }
  const document = opts.unbounded ? (raw as ChipDocument) : requireChipDocument(raw)
  return {
    document,
    banks,
    manifold: { ...manifold, target },
    chip: { width: frame.width, height: frame.height, columns: grid.columns, rows: grid.rows, wafer: frame.wafer },
    warnings,
  }
}

/** A valid chip document with `nozzles` parallel step nozzles on sized ladder manifolds. */
export function generateParallelChip(opts: ParallelChipOptions): ChipDocument {
  return planParallelChip(opts).document
}
