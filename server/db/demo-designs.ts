// The demo scenario's chip documents (invented values): Quillmere Single-Cell Lab encapsulates single cells in
// droplets of about 40 µm. Each design lists its revisions oldest first.
import { generateParallelChip } from '../../geometry/arrays'
import type { ChipDocumentInput } from '../../shared/schemas/chip'
import { starterDocument } from '../services/starterDocument'

// The starter T-junction, on a 25 µm deep layer, with the given widths (µm) and flows (µL/min).
function tJunction(mainWidth: number, inletWidth: number, qc: number, qd: number): ChipDocumentInput {
  const d = structuredClone(starterDocument('Cell encapsulation T-junction')) as unknown as Record<string, any>
  d.layers = [{ id: 'ch25', name: 'Channels', depth: 25 }]
  for (const port of d.ports) port.layerId = 'ch25'
  Object.assign(d.components[0], { layerId: 'ch25', mainWidth, inletWidth, armLength: Math.max(200, mainWidth) })
  for (const c of d.channels)
    Object.assign(c, { layerId: 'ch25', width: c.id === 'water-feed' ? inletWidth : mainWidth })
  d.operatingPoints[0].name = 'Cells in 40 µm drops'
  d.operatingPoints[0].inlets = [
    { portId: 'oil-in', mode: 'flow', value: qc, unit: 'uL/min' },
    { portId: 'water-in', mode: 'flow', value: qd, unit: 'uL/min' },
  ]
  d.marks[1].text = 'QSC TJ'
  return d as ChipDocumentInput
}

const flowFocusing = (orificeWidth: number): ChipDocumentInput =>
  ({
    version: 1,
    name: 'Hydrogel bead flow-focuser',
    units: 'um',
    layers: [{ id: 'ch50', name: 'Channels', depth: 50 }],
    ports: [
      {
        id: 'gel-in',
        kind: 'inlet',
        position: { x: 1500, y: 4500 },
        punchDiameter: 750,
        layerId: 'ch50',
        feed: { phase: 'dispersed' },
      },
      {
        id: 'oil-a',
        kind: 'inlet',
        position: { x: 6000, y: 7500 },
        punchDiameter: 750,
        layerId: 'ch50',
        feed: { phase: 'continuous' },
      },
      {
        id: 'oil-b',
        kind: 'inlet',
        position: { x: 6000, y: 1500 },
        punchDiameter: 750,
        layerId: 'ch50',
        feed: { phase: 'continuous' },
      },
      { id: 'out', kind: 'outlet', position: { x: 10500, y: 4500 }, punchDiameter: 1000, layerId: 'ch50' },
    ],
    components: [
      {
        id: 'ff-1',
        kind: 'flow-focusing',
        position: { x: 6000, y: 4500 },
        rotation: 0,
        layerId: 'ch50',
        orificeWidth: orificeWidth,
        orificeLength: 60,
        continuousWidth: 80,
        dispersedWidth: 60,
        outletWidth: 150,
        armLength: 200,
      },
    ],
    channels: [
      {
        id: 'gel-feed',
        layerId: 'ch50',
        width: 60,
        points: [
          { x: 1500, y: 4500 },
          { x: 5800, y: 4500 },
        ],
        start: { element: 'gel-in', terminal: 'port' },
        end: { element: 'ff-1', terminal: 'dispersed' },
      },
      {
        id: 'oil-feed-a',
        layerId: 'ch50',
        width: 80,
        points: [
          { x: 6000, y: 7500 },
          { x: 6000, y: 4700 },
        ],
        start: { element: 'oil-a', terminal: 'port' },
        end: { element: 'ff-1', terminal: 'continuous-a' },
      },
      {
        id: 'oil-feed-b',
        layerId: 'ch50',
        width: 80,
        points: [
          { x: 6000, y: 1500 },
          { x: 6000, y: 4300 },
        ],
        start: { element: 'oil-b', terminal: 'port' },
        end: { element: 'ff-1', terminal: 'continuous-b' },
      },
      {
        id: 'beads-out',
        layerId: 'ch50',
        width: 150,
        points: [
          { x: 6300, y: 4500 },
          { x: 10500, y: 4500 },
        ],
        start: { element: 'ff-1', terminal: 'outlet' },
        end: { element: 'out', terminal: 'port' },
      },
    ],
    outline: { kind: 'rectangle', corner: { x: 0, y: 0 }, width: 12000, height: 9000 },
    marks: [
      { id: 'align-1', kind: 'cross', position: { x: 600, y: 600 }, size: 400, lineWidth: 40, layerIds: [] },
      { id: 'label', kind: 'text', position: { x: 8500, y: 800 }, text: 'QSC FF', height: 300, layerIds: [] },
    ],
    operatingPoints: [
      {
        id: 'op-1',
        name: 'Beads at 4:1 oil',
        temperatureC: 22,
        continuousLiquid: { liquid: 'light-mineral-oil' },
        dispersedLiquid: { liquid: 'water' },
        surfactant: 'sorbitan-monooleate',
        inlets: [
          { portId: 'gel-in', mode: 'flow', value: 1, unit: 'uL/min' },
          { portId: 'oil-a', mode: 'flow', value: 2, unit: 'uL/min' },
          { portId: 'oil-b', mode: 'flow', value: 2, unit: 'uL/min' },
        ],
      },
    ],
    activeOperatingPoint: 'op-1',
  }) as unknown as ChipDocumentInput

// The generated ladder runs a fluorinated oil; its tension with water, with a fluorinated surfactant, is set
// here as a typical value (from memory, about 2–5 mN/m for such pairs).
function stepLadder(): ChipDocumentInput {
  const doc = generateParallelChip({ nozzles: 64, name: 'Parallel step emulsifier, 64 nozzles' }) as unknown as {
    operatingPoints: Array<Record<string, unknown>>
  }
  // 20 mbar on the dispersed inlet keeps every nozzle below the step-emulsification critical capillary number.
  doc.operatingPoints = doc.operatingPoints.map(op => ({
    ...op,
    interfacialTensionMNPerM: 3,
    inlets: (op.inlets as Array<{ mode: string; unit: string; value: number }>).map(i =>
      i.mode === 'pressure' ? { ...i, value: 20 } : i,
    ),
  }))
  return doc as unknown as ChipDocumentInput
}

export interface DemoRevision {
  message: string
  document: ChipDocumentInput
}
export interface DemoDesign {
  name: string
  description: string
  revisions: DemoRevision[]
}

export function demoDesigns(): DemoDesign[] {
  return [
    {
      name: 'Cell encapsulation T-junction',
      description: 'Single cells in about 40 µm water-in-oil droplets; hexadecane with sorbitan monooleate.',
      revisions: [
        { message: 'First layout from the bench sketch', document: tJunction(50, 40, 0.8, 0.4) },
        { message: 'Narrower main channel for smaller drops', document: tJunction(40, 30, 0.6, 0.3) },
        { message: 'Main channel 35 µm, lower flows, per review', document: tJunction(35, 25, 0.5, 0.25) },
      ],
    },
    {
      name: 'Hydrogel bead flow-focuser',
      description: 'Flow-focusing cross for gel-precursor beads in light mineral oil.',
      revisions: [
        { message: 'Cross with a 60 µm orifice', document: flowFocusing(60) },
        { message: 'Orifice narrowed to 40 µm', document: flowFocusing(40) },
      ],
    },
    {
      name: 'Parallel step emulsifier, 64 nozzles',
      description: 'Step-emulsification ladder for high-throughput droplet libraries.',
      revisions: [{ message: 'Generated ladder, 64 nozzles', document: stepLadder() }],
    },
  ]
}
