// A new chip document from a geometry suggestion: the product's own generators lay out the junctions (or step
// nozzles) with their manifolds, so the design rules see the same drawing the editor and the mask would.
import { generateParallelChip, generateTJunctionChip } from '../../../geometry/arrays'
import { requireChipDocument, type ChipDocument, type OperatingPoint } from '../../schemas/chip'
import type { GeometrySuggestion } from './geometry'

/** What the plan knows of the liquids, in the document's terms. */
export type PlannedLiquids = Partial<
  Pick<
    OperatingPoint,
    | 'continuousLiquid'
    | 'dispersedLiquid'
    | 'surfactant'
    | 'interfacialTensionMNPerM'
    | 'temperatureC'
    | 'contactAngleDeg'
  >
>

const um = (m: number) => Math.round(m * 4e6) / 4 // µm, to 0.25 µm

/** One flow-focusing cross (invented starting layout, sizes from the suggestion). */
function flowFocusingChip(s: GeometrySuggestion, name: string): ChipDocument {
  const w = um(s.junction.mainWidth.value)
  const h = um(s.junction.depth.value)
  const feed = Math.max(2 * w, 60)
  const qc = s.flow.continuous.value * 6e10
  const qd = s.flow.dispersed.value * 6e10
  return requireChipDocument({
    version: 1,
    name,
    units: 'um',
    layers: [{ id: 'ch', name: 'Channels', depth: h }],
    ports: [
      {
        id: 'drops-in',
        kind: 'inlet',
        position: { x: 1500, y: 4500 },
        punchDiameter: 750,
        layerId: 'ch',
        feed: { phase: 'dispersed' },
      },
      {
        id: 'oil-a',
        kind: 'inlet',
        position: { x: 6000, y: 7500 },
        punchDiameter: 750,
        layerId: 'ch',
        feed: { phase: 'continuous' },
      },
      {
        id: 'oil-b',
        kind: 'inlet',
        position: { x: 6000, y: 1500 },
        punchDiameter: 750,
        layerId: 'ch',
        feed: { phase: 'continuous' },
      },
      { id: 'out', kind: 'outlet', position: { x: 10500, y: 4500 }, punchDiameter: 1000, layerId: 'ch' },
    ],
    components: [
      {
        id: 'ff-1',
        kind: 'flow-focusing',
        position: { x: 6000, y: 4500 },
        rotation: 0,
        layerId: 'ch',
        orificeWidth: w,
        orificeLength: Math.max(w, 40),
        continuousWidth: feed,
        dispersedWidth: feed,
        outletWidth: Math.max(3 * w, 100),
        armLength: 200,
      },
    ],
    channels: [],
    outline: { kind: 'rectangle', corner: { x: 0, y: 0 }, width: 12000, height: 9000 },
    marks: [],
    operatingPoints: [
      {
        id: 'op-1',
        name: 'Planned point',
        temperatureC: 20,
        continuousLiquid: { liquid: 'hydrofluoroether' },
        dispersedLiquid: { liquid: 'water' },
        inlets: [
          { portId: 'drops-in', mode: 'flow', value: qd, unit: 'uL/min' },
          { portId: 'oil-a', mode: 'flow', value: qc / 2, unit: 'uL/min' },
          { portId: 'oil-b', mode: 'flow', value: qc / 2, unit: 'uL/min' },
        ],
      },
    ],
    activeOperatingPoint: 'op-1',
  })
}

/** The chip for `s`: step nozzles on ladder manifolds, T-junctions on banks, or one flow-focusing cross. */
export function designFromSuggestion(s: GeometrySuggestion, name: string, liquids: PlannedLiquids = {}): ChipDocument {
  let doc: ChipDocument
  if (s.kind === 'step') {
    doc = generateParallelChip({
      nozzles: s.count,
      name,
      nozzleWidth: um(s.junction.mainWidth.value),
      nozzleDepth: um(s.junction.depth.value),
      pitch: um(s.pitch!.value),
    })
  } else if (s.kind === 't-junction') {
    doc = generateTJunctionChip({
      junctions: s.count,
      name,
      mainWidth: um(s.junction.mainWidth.value),
      inletWidth: um(s.junction.inletWidth.value),
      junctionDepth: um(s.junction.depth.value),
      flowPerJunction: { continuous: s.flow.continuous.value * 6e10, dispersed: s.flow.dispersed.value * 6e10 },
    })
  } else {
    doc = flowFocusingChip(s, name)
  }
  const ops = doc.operatingPoints.map(op => ({ ...op, name: 'Planned point', ...liquids }))
  return requireChipDocument({ ...doc, operatingPoints: ops })
}
