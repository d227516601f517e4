// The flow-focusing and step-emulsifier starter chips (invented example values; see starterDocument.ts).

/** A flow-focusing cross: water along the axis, oil from two sides, a 40 µm orifice, 30 µm deep. */
export const FLOW_FOCUSING_STARTER = {
  version: 1,
  name: '__NAME__',
  units: 'um',
  layers: [{ id: 'ch30', name: 'Channels', depth: 30 }],
  ports: [
    {
      id: 'water-in',
      kind: 'inlet',
      position: { x: 1500, y: 4000 },
      punchDiameter: 750,
      layerId: 'ch30',
      feed: { phase: 'dispersed' },
    },
    {
      id: 'oil-in-a',
      kind: 'inlet',
      position: { x: 5000, y: 6500 },
      punchDiameter: 750,
      layerId: 'ch30',
      feed: { phase: 'continuous' },
    },
    {
      id: 'oil-in-b',
      kind: 'inlet',
      position: { x: 5000, y: 1500 },
      punchDiameter: 750,
      layerId: 'ch30',
      feed: { phase: 'continuous' },
    },
    { id: 'out', kind: 'outlet', position: { x: 8500, y: 4000 }, punchDiameter: 1000, layerId: 'ch30' },
  ],
  components: [
    {
      id: 'ff-1',
      kind: 'flow-focusing',
      position: { x: 5000, y: 4000 },
      rotation: 0,
      layerId: 'ch30',
      orificeWidth: 40,
      orificeLength: 60,
      continuousWidth: 80,
      dispersedWidth: 50,
      outletWidth: 100,
      armLength: 200,
    },
  ],
  channels: [
    {
      id: 'water-feed',
      layerId: 'ch30',
      width: 50,
      points: [
        { x: 1500, y: 4000 },
        { x: 4800, y: 4000 },
      ],
      start: { element: 'water-in', terminal: 'port' },
      end: { element: 'ff-1', terminal: 'dispersed' },
    },
    {
      id: 'oil-feed-a',
      layerId: 'ch30',
      width: 80,
      points: [
        { x: 5000, y: 6500 },
        { x: 5000, y: 4200 },
      ],
      start: { element: 'oil-in-a', terminal: 'port' },
      end: { element: 'ff-1', terminal: 'continuous-a' },
    },
    {
      id: 'oil-feed-b',
      layerId: 'ch30',
      width: 80,
      points: [
        { x: 5000, y: 1500 },
        { x: 5000, y: 3800 },
      ],
      start: { element: 'oil-in-b', terminal: 'port' },
      end: { element: 'ff-1', terminal: 'continuous-b' },
    },
    {
      id: 'drops-out',
      layerId: 'ch30',
      width: 100,
      points: [
        { x: 5300, y: 4000 },
        { x: 8500, y: 4000 },
      ],
      start: { element: 'ff-1', terminal: 'outlet' },
      end: { element: 'out', terminal: 'port' },
    },
  ],
  outline: { kind: 'rectangle', corner: { x: 0, y: 0 }, width: 10000, height: 8000 },
  marks: [
    { id: 'align-1', kind: 'cross', position: { x: 600, y: 600 }, size: 400, lineWidth: 40, layerIds: [] },
    { id: 'label', kind: 'text', position: { x: 6500, y: 500 }, text: 'DW FF 01', height: 300, layerIds: [] },
  ],
  operatingPoints: [
    {
      id: 'op-1',
      name: 'Water in fluorinated oil',
      temperatureC: 22,
      continuousLiquid: { liquid: 'hydrofluoroether' },
      dispersedLiquid: { liquid: 'water' },
      surfactant: 'fluorinated-block-copolymer',
      inlets: [
        { portId: 'water-in', mode: 'flow', value: 0.3, unit: 'uL/min' },
        { portId: 'oil-in-a', mode: 'flow', value: 0.6, unit: 'uL/min' },
        { portId: 'oil-in-b', mode: 'flow', value: 0.6, unit: 'uL/min' },
      ],
    },
  ],
  activeOperatingPoint: 'op-1',
}

/** One step nozzle: a 10 µm deep, 40 µm wide nozzle opens into a 60 µm deep reservoir where oil carries drops off. */
export const STEP_EMULSIFIER_STARTER = {
  version: 1,
  name: '__NAME__',
  units: 'um',
  layers: [
    { id: 'nozzle10', name: 'Nozzle', depth: 10 },
    { id: 'reservoir60', name: 'Reservoir', depth: 60 },
  ],
  ports: [
    {
      id: 'water-in',
      kind: 'inlet',
      position: { x: 1500, y: 4000 },
      punchDiameter: 750,
      layerId: 'nozzle10',
      feed: { phase: 'dispersed' },
    },
    {
      id: 'oil-in',
      kind: 'inlet',
      position: { x: 5250, y: 1500 },
      punchDiameter: 750,
      layerId: 'reservoir60',
      feed: { phase: 'continuous' },
    },
    { id: 'out', kind: 'outlet', position: { x: 5250, y: 6500 }, punchDiameter: 1000, layerId: 'reservoir60' },
  ],
  components: [
    {
      id: 'sn-1',
      kind: 'step-nozzle',
      position: { x: 5000, y: 4000 },
      rotation: 0,
      layerId: 'nozzle10',
      reservoirLayerId: 'reservoir60',
      nozzleWidth: 40,
      nozzleLength: 150,
      reservoirWidth: 200,
      reservoirLength: 600,
    },
  ],
  channels: [
    {
      id: 'water-feed',
      layerId: 'nozzle10',
      width: 40,
      points: [
        { x: 1500, y: 4000 },
        { x: 5000, y: 4000 },
      ],
      start: { element: 'water-in', terminal: 'port' },
      end: { element: 'sn-1', terminal: 'dispersed' },
    },
    {
      id: 'oil-feed',
      layerId: 'reservoir60',
      width: 200,
      points: [
        { x: 5250, y: 1500 },
        { x: 5250, y: 3700 },
      ],
      start: { element: 'oil-in', terminal: 'port' },
      end: { element: 'sn-1', terminal: 'continuous' },
    },
    {
      id: 'drops-out',
      layerId: 'reservoir60',
      width: 200,
      points: [
        { x: 5250, y: 4300 },
        { x: 5250, y: 6500 },
      ],
      start: { element: 'sn-1', terminal: 'outlet' },
      end: { element: 'out', terminal: 'port' },
    },
  ],
  outline: { kind: 'rectangle', corner: { x: 0, y: 0 }, width: 10000, height: 8000 },
  marks: [
    { id: 'align-1', kind: 'cross', position: { x: 600, y: 600 }, size: 400, lineWidth: 40, layerIds: [] },
    { id: 'label', kind: 'text', position: { x: 6500, y: 500 }, text: 'DW SE 01', height: 300, layerIds: [] },
  ],
  operatingPoints: [
    {
      id: 'op-1',
      name: 'Uniform 40 µm drops',
      temperatureC: 22,
      contactAngleDeg: 150,
      continuousLiquid: { liquid: 'hydrofluoroether' },
      dispersedLiquid: { liquid: 'water' },
      surfactant: 'fluorinated-block-copolymer',
      inlets: [
        { portId: 'water-in', mode: 'flow', value: 0.05, unit: 'uL/min' },
        { portId: 'oil-in', mode: 'flow', value: 5, unit: 'uL/min' },
      ],
    },
  ],
  activeOperatingPoint: 'op-1',
}
