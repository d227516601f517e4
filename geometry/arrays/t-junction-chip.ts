import type { ChipDocument } from '#shared/schemas/chip'
import { requireChipDocument } from '#shared/schemas/chip'
import { designPoint } from './elements'
import { frameChip, gridBanks, waferNote } from './layout'
import { rectResistancePerViscosity, sizeManifold } from './resistance'
import { tJunctionBankElements } from './t-junction-bank'
import type { TJunctionBankArgs } from './t-junction-bank'
import type { WaferFit } from './wafer'

export interface TJunctionChipOptions {
  /** Total number of T-junctions. */
  junctions: number
  /** Junctions per bank; banks sit on a grid, each with its two inlet punches. Default 8. */
  junctionsPerBank?: number
  name?: string
  /** Junction pitch (≥ punch + 1,000 µm so outlet punches keep the process spacing), µm. Default 2,000. */
  pitch?: number
  mainWidth?: number
  inletWidth?: number
  armLength?: number
  /** Depth of the junction layer (junctions, branches, outlets), µm. Default 50. */
  junctionDepth?: number
  /** Depth of the manifold layer, µm. Default 150. */
  manifoldDepth?: number
  /** Shortest continuous and dispersed branch, µm (lengthened when the manifolds alone cannot meet the target). */
  branchLength?: number
  /** Largest acceptable first-order flow non-uniformity across a bank, for each phase (default 0.01 = 1 %). */
  targetNonUniformity?: number
  maxManifoldWidth?: number
  /** Longest branch the planner may draw, µm. Default 30,000. */
  maxBranchLength?: number
  /** Flow per junction at the design point, µL/min (continuous, dispersed). Default 2 and 0.5. */
  flowPerJunction?: { continuous: number; dispersed: number }
}

export interface ManifoldSizing {
  width: number
  branchLength: number
  nonUniformity: number
  target: number
}

export interface TJunctionChipPlan {
  document: ChipDocument
  banks: number
  continuous: ManifoldSizing
  dispersed: ManifoldSizing
  chip: { width: number; height: number; columns: number; rows: number; wafer: WaferFit }
  warnings: string[]
}

const OUTLET_LENGTH = 1500
const PUNCH = 1000
const CLEARANCE = 1000

/**
 * Sizes one supply ladder: the narrowest manifold meeting the target with the branch as drawn; when even the
 * widest allowed manifold misses it, the branch is lengthened (δ ∝ 1/R_branch, resistance.ts) up to `maxBranch`.
 * `fixed` is the resistance length of the path beyond the branch (junction arms, outlet), µm.
 */
function sizeLadder(a: {
  n: number
  branchWidth: number
  depth: number
  fixed: number
  branch: number
  maxBranch: number
  manifoldDepth: number
  pitch: number
  target: number
  minWidth: number
  maxWidth: number
}): ManifoldSizing {
  const size = (branch: number) =>
    sizeManifold({
      nozzle: rectResistancePerViscosity(a.branchWidth, a.depth, branch + a.fixed),
      n: a.n,
      depth: a.manifoldDepth,
      segmentLength: a.pitch,
      target: a.target,
      minWidth: a.minWidth,
      maxWidth: a.maxWidth,
    })
  let branchLength = a.branch
  let m = size(branchLength)
  if (m.nonUniformity > a.target) {
    const needed = (branchLength + a.fixed) * (m.nonUniformity / a.target) - a.fixed
    branchLength = Math.min(a.maxBranch, Math.ceil(needed / 100) * 100)
    m = size(branchLength)
  }
  return { width: m.width, branchLength, nonUniformity: m.nonUniformity, target: a.target }
}

/**
 * Plans a chip of N parallel T-junctions on two sized supply ladders (continuous and dispersed manifolds on a
 * deep layer, junctions and branches on a shallower one); each outlet ends in its own punch, the punches of a
 * bank in one row to be gathered by one collection well (see t-junction-bank.ts for why not on chip).
 */
export function planTJunctionChip(opts: TJunctionChipOptions): TJunctionChipPlan {
  const n = Math.floor(opts.junctions)
  if (!(n >= 1)) throw new RangeError(`Junction count must be a whole number ≥ 1 (got ${opts.junctions})`)
  const perBank = Math.max(1, Math.floor(opts.junctionsPerBank ?? 8))
  const mainWidth = opts.mainWidth ?? 60
  const inletWidth = opts.inletWidth ?? 40
  const armLength = opts.armLength ?? Math.max(200, 2 * Math.max(mainWidth, inletWidth))
  const depth = opts.junctionDepth ?? 50
  const manifoldDepth = opts.manifoldDepth ?? 150
  const pitch = opts.pitch ?? 2000
  if (pitch < PUNCH + 1000)
    throw new RangeError(
      `Junction pitch must be ≥ ${PUNCH + 1000} µm so the outlet punches stay 1,000 µm apart (got ${pitch})`,
    )
  const target = opts.targetNonUniformity ?? 0.01
  const common = {
    n: Math.min(n, perBank),
    depth,
    manifoldDepth,
    pitch,
    target,
    branch: opts.branchLength ?? 2000,
    maxBranch: opts.maxBranchLength ?? 30000,
    maxWidth: opts.maxManifoldWidth ?? 2000,
  }
  const continuous = sizeLadder({
    ...common,
    branchWidth: mainWidth,
    fixed: 2 * armLength + OUTLET_LENGTH,
    minWidth: Math.max(200, 2 * mainWidth),
  })
  const dispersed = sizeLadder({
    ...common,
    branchWidth: inletWidth,
    fixed: armLength,
    minWidth: Math.max(200, 2 * inletWidth),
  })

  const args = (bank: number): TJunctionBankArgs => ({
    bank,
    count: Math.min(perBank, n - bank * perBank),
    pitch,
    mainWidth,
    inletWidth,
    armLength,
    continuousBranch: continuous.branchLength,
    dispersedBranch: dispersed.branchLength,
    outletLength: OUTLET_LENGTH,
    continuousManifoldWidth: continuous.width,
    dispersedManifoldWidth: dispersed.width,
    punch: PUNCH,
    clearance: CLEARANCE,
  })
  const banks = Math.ceil(n / perBank)
  const grid = gridBanks(
    Array.from({ length: banks }, (_, b) => tJunctionBankElements(args(b))),
    armLength,
  )
  const frame = frameChip(grid.banks, armLength, `DW T-junction array ${n}`, ['junction', 'deep'])
  const note = waferNote(opts.name ?? `Parallel T-junctions, ${n} junctions`, frame)
  const warnings = [...note.warnings]
  for (const [phase, s] of [
    ['continuous', continuous],
    ['dispersed', dispersed],
  ] as const) {
    if (s.nonUniformity > target) {
      warnings.push(
        `The ${phase} manifold reaches ${(100 * s.nonUniformity).toFixed(1)} % flow non-uniformity, above the ${(100 * target).toFixed(1)} % target, with a ${s.branchLength} µm branch: use fewer junctions per bank or allow longer branches`,
      )
    }
  }
  // Flows per junction are a starting point for the editor (common practice, no source); the forecast decides.
  const flow = opts.flowPerJunction ?? { continuous: 2, dispersed: 0.5 }
  const document = requireChipDocument({
    version: 1,
    name: note.name,
    units: 'um',
    layers: [
      { id: 'junction', name: 'Junctions and branches', depth },
      { id: 'deep', name: 'Supply manifolds (deep)', depth: manifoldDepth },
    ],
    ports: grid.banks.flatMap(x => x.ports),
    components: grid.banks.flatMap(x => x.components),
    channels: grid.banks.flatMap(x => x.channels),
    outline: frame.outline,
    marks: frame.marks,
    operatingPoints: [
      designPoint(
        Array.from({ length: banks }, (_, b) => {
          const count = Math.min(perBank, n - b * perBank)
          return [
            { portId: `b${b}-cont-in`, mode: 'flow' as const, value: flow.continuous * count, unit: 'uL/min' as const },
            { portId: `b${b}-disp-in`, mode: 'flow' as const, value: flow.dispersed * count, unit: 'uL/min' as const },
          ]
        }).flat(),
      ),
    ],
    activeOperatingPoint: 'op-1',
  })
  return {
    document,
    banks,
    continuous,
    dispersed,
    chip: { width: frame.width, height: frame.height, columns: grid.columns, rows: grid.rows, wafer: frame.wafer },
    warnings,
  }
}

/** A valid chip document with `junctions` parallel T-junctions on sized supply manifolds. */
export function generateTJunctionChip(opts: TJunctionChipOptions): ChipDocument {
  return planTJunctionChip(opts).document
}
