// A new design starts from a small, valid chip (invented example values): one T-junction (the default), one
// flow-focusing cross, or one step emulsifier; each has two inlet phases, one outlet and an operating point that
// forecasts cleanly on the built-in liquids (tests/unit/starters.test.ts).
import { requireChipDocument, type ChipDocument } from '#shared/schemas/chip'
import { STARTER_KINDS } from '#shared/schemas/designs'
import { FLOW_FOCUSING_STARTER, STEP_EMULSIFIER_STARTER } from './starterDocuments'

export const STARTERS = STARTER_KINDS
export type StarterKind = (typeof STARTERS)[number]

const STARTER = {
  version: 1,
  name: '__NAME__',
  units: 'um',
  layers: [{ id: 'ch50', name: 'Channels', depth: 50 }],
  ports: [
    {
      id: 'oil-in',
      kind: 'inlet',
      position: { x: 1500, y: 3000 },
      punchDiameter: 750,
      layerId: 'ch50',
      feed: { phase: 'continuous' },
    },
    {
      id: 'water-in',
      kind: 'inlet',
      position: { x: 6500, y: 5500 },
      punchDiameter: 750,
      layerId: 'ch50',
      feed: { phase: 'dispersed' },
    },
    { id: 'out', kind: 'outlet', position: { x: 8500, y: 3000 }, punchDiameter: 1000, layerId: 'ch50' },
  ],
  components: [
    {
      id: 'tj-1',
      kind: 't-junction',
      position: { x: 5000, y: 3000 },
      rotation: 0,
      layerId: 'ch50',
      mainWidth: 100,
      inletWidth: 50,
      armLength: 200,
    },
  ],
  channels: [
    {
      id: 'oil-feed',
      layerId: 'ch50',
      width: 100,
      points: [
        { x: 1500, y: 3000 },
        { x: 4800, y: 3000 },
      ],
      start: { element: 'oil-in', terminal: 'port' },
      end: { element: 'tj-1', terminal: 'continuous' },
    },
    {
      id: 'water-feed',
      layerId: 'ch50',
      width: 50,
      points: [
        { x: 6500, y: 5500 },
        { x: 5000, y: 5500 },
        { x: 5000, y: 3200 },
      ],
      start: { element: 'water-in', terminal: 'port' },
      end: { element: 'tj-1', terminal: 'dispersed' },
    },
    {
      id: 'drops-out',
      layerId: 'ch50',
      width: 100,
      points: [
        { x: 5200, y: 3000 },
        { x: 8500, y: 3000 },
      ],
      start: { element: 'tj-1', terminal: 'outlet' },
      end: { element: 'out', terminal: 'port' },
    },
  ],
  outline: { kind: 'rectangle', corner: { x: 0, y: 0 }, width: 10000, height: 7000 },
  marks: [
    { id: 'align-1', kind: 'cross', position: { x: 600, y: 600 }, size: 400, lineWidth: 40, layerIds: [] },
    { id: 'label', kind: 'text', position: { x: 6500, y: 500 }, text: 'DW TJ 01', height: 300, layerIds: [] },
  ],
  operatingPoints: [
    {
      id: 'op-1',
      name: 'Cells in 40 µm drops',
      temperatureC: 22,
      continuousLiquid: { liquid: 'n-hexadecane' },
      dispersedLiquid: { liquid: 'water' },
      surfactant: 'sorbitan-monooleate',
      inlets: [
        { portId: 'oil-in', mode: 'flow', value: 3, unit: 'uL/min' },
        { portId: 'water-in', mode: 'flow', value: 1.5, unit: 'uL/min' },
      ],
    },
  ],
  activeOperatingPoint: 'op-1',
}

const BY_KIND: Record<StarterKind, Record<string, unknown>> = {
  't-junction': STARTER,
  'flow-focusing': FLOW_FOCUSING_STARTER,
  'step-emulsifier': STEP_EMULSIFIER_STARTER,
}

export function starterDocument(name: string, kind: StarterKind = 't-junction'): ChipDocument {
  return requireChipDocument({ ...BY_KIND[kind], name })
}
