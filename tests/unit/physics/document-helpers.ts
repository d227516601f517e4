// Documents for the document-forecast tests: a mixed chip with every junction kind, and whole-document moves.
import { readFileSync } from 'node:fs'
import {
  componentTerminals,
  requireChipDocument,
  type ChipDocument,
  type ChipDocumentInput,
  type Component,
} from '#shared/schemas/chip'

type Point = { x: number; y: number }

export function loadDocument(name: string): ChipDocument {
  return requireChipDocument(
    JSON.parse(readFileSync(new URL(`../../fixtures/documents/${name}.json`, import.meta.url), 'utf8')),
  )
}

const terminalAt = (c: ChipDocumentInput['components'], id: string, name: string): Point => {
  const component = requireComponent(c, id)
  return componentTerminals(component).find(t => t.name === name)!.position
}
const requireComponent = (list: ChipDocumentInput['components'], id: string): Component => {
  const found = requireChipDocument({
    version: 1,
    name: 'x',
    units: 'um',
    layers: [
      { id: 'ch50', name: 'a', depth: 50 },
      { id: 'shallow', name: 'b', depth: 10 },
      { id: 'deep', name: 'c', depth: 120 },
    ],
    components: (list ?? []).filter(c => c.id === id),
  })
  return found.components[0]!
}

/**
 * A chip with a flow-focusing cross fed through a serpentine, a T-junction and a Y-junction in series after it,
 * and a 16-nozzle step array; some channel ends are free and meet by coincidence (a split, a joint on a
 * serpentine terminal). Invented for the tests; flows chosen so every junction has both phases.
 */
export function mixedChip(): ChipDocument {
  const components: NonNullable<ChipDocumentInput['components']> = [
    {
      id: 'serp-1',
      kind: 'serpentine',
      position: { x: 1000, y: 6000 },
      rotation: 0,
      layerId: 'ch50',
      turns: 6,
      pitch: 200,
      width: 60,
      totalLength: 12000,
    },
    {
      id: 'ff-1',
      kind: 'flow-focusing',
      position: { x: 5000, y: 3000 },
      rotation: 0,
      layerId: 'ch50',
      orificeWidth: 40,
      orificeLength: 60,
      continuousWidth: 80,
      dispersedWidth: 60,
      outletWidth: 120,
      armLength: 300,
    },
    {
      id: 'tj-1',
      kind: 't-junction',
      position: { x: 9000, y: 3000 },
      rotation: 0,
      layerId: 'ch50',
      mainWidth: 120,
      inletWidth: 60,
      armLength: 250,
    },
    {
      id: 'yj-1',
      kind: 'y-junction',
      position: { x: 12000, y: 3000 },
      rotation: 0,
      layerId: 'ch50',
      angle: 60,
      continuousWidth: 120,
      dispersedWidth: 60,
      outletWidth: 150,
      armLength: 300,
    },
    {
      id: 'arr-1',
      kind: 'step-array',
      position: { x: 6000, y: 12000 },
      rotation: 90,
      layerId: 'shallow',
      supplyLayerId: 'deep',
      reservoirLayerId: 'deep',
      nozzleCount: 16,
      pitch: 80,
      nozzleWidth: 40,
      nozzleLength: 200,
      supplyWidth: 300,
      reservoirWidth: 500,
      margin: 200,
    },
  ]
  const t = (id: string, name: string) => terminalAt(components, id, name)
  const ref = (element: string, terminal: string) => ({ element, terminal })
  const ports = [
    {
      id: 'water-in',
      kind: 'inlet' as const,
      position: { x: 500, y: 8000 },
      punchDiameter: 750,
      layerId: 'ch50',
      feed: { phase: 'dispersed' as const },
    },
    {
      id: 'oil-in',
      kind: 'inlet' as const,
      position: { x: 2000, y: 500 },
      punchDiameter: 750,
      layerId: 'ch50',
      feed: { phase: 'continuous' as const },
    },
    {
      id: 'water2-in',
      kind: 'inlet' as const,
      position: { x: 9000, y: 5000 },
      punchDiameter: 750,
      layerId: 'ch50',
      feed: { phase: 'dispersed' as const },
    },
    {
      id: 'water3-in',
      kind: 'inlet' as const,
      position: { x: 11000, y: 5000 },
      punchDiameter: 750,
      layerId: 'ch50',
      feed: { phase: 'dispersed' as const },
    },
    { id: 'out', kind: 'outlet' as const, position: { x: 15000, y: 3000 }, punchDiameter: 1000, layerId: 'ch50' },
    {
      id: 'arr-water',
      kind: 'inlet' as const,
      position: { x: 3000, y: 14000 },
      punchDiameter: 750,
      layerId: 'deep',
      feed: { phase: 'dispersed' as const },
    },
    {
      id: 'arr-oil',
      kind: 'inlet' as const,
      position: { x: 3000, y: 16000 },
      punchDiameter: 750,
      layerId: 'deep',
      feed: { phase: 'continuous' as const },
    },
    { id: 'arr-out', kind: 'outlet' as const, position: { x: 9000, y: 16000 }, punchDiameter: 1000, layerId: 'deep' },
  ]
  const split = { x: 3000, y: 1500 }
  const joint = { x: 3500, y: 4500 }
  const channels = [
    {
      id: 'w-feed',
      layerId: 'ch50',
      width: 60,
      points: [ports[0]!.position, { x: 500, y: 6000 }, t('serp-1', 'inlet')],
      start: ref('water-in', 'port'),
      end: ref('serp-1', 'inlet'),
    },
    // Free start on the serpentine's outlet terminal, free end meeting w-b's free start.
    {
      id: 'w-a',
      layerId: 'ch50',
      width: 60,
      points: [t('serp-1', 'outlet'), { x: 3500, y: t('serp-1', 'outlet').y }, joint],
    },
    {
      id: 'w-b',
      layerId: 'ch50',
      width: 60,
      points: [joint, { x: 3500, y: 3000 }, t('ff-1', 'dispersed')],
      end: ref('ff-1', 'dispersed'),
    },
    { id: 'o-feed', layerId: 'ch50', width: 100, points: [ports[1]!.position, split], start: ref('oil-in', 'port') },
    {
      id: 'o-a',
      layerId: 'ch50',
      width: 80,
      points: [split, { x: 3000, y: 2200 }, { x: 5000, y: 2200 }, t('ff-1', 'continuous-b')],
      end: ref('ff-1', 'continuous-b'),
    },
    {
      id: 'o-b',
      layerId: 'ch50',
      width: 80,
      points: [split, { x: 4200, y: 1500 }, { x: 4200, y: 3800 }, { x: 5000, y: 3800 }, t('ff-1', 'continuous-a')],
      end: ref('ff-1', 'continuous-a'),
    },
    {
      id: 'ff-out',
      layerId: 'ch50',
      width: 120,
      points: [t('ff-1', 'outlet'), t('tj-1', 'continuous')],
      start: ref('ff-1', 'outlet'),
      end: ref('tj-1', 'continuous'),
    },
    {
      id: 'w2-feed',
      layerId: 'ch50',
      width: 60,
      points: [ports[2]!.position, t('tj-1', 'dispersed')],
      start: ref('water2-in', 'port'),
      end: ref('tj-1', 'dispersed'),
    },
    {
      id: 'tj-out',
      layerId: 'ch50',
      width: 120,
      points: [t('tj-1', 'outlet'), { x: 11000, y: 3000 }, t('yj-1', 'continuous')],
      start: ref('tj-1', 'outlet'),
      end: ref('yj-1', 'continuous'),
    },
    {
      id: 'w3-feed',
      layerId: 'ch50',
      width: 60,
      points: [ports[3]!.position, { x: 11000, y: 2000 }, t('yj-1', 'dispersed')],
      start: ref('water3-in', 'port'),
      end: ref('yj-1', 'dispersed'),
    },
    {
      id: 'yj-out',
      layerId: 'ch50',
      width: 150,
      points: [t('yj-1', 'outlet'), ports[4]!.position],
      start: ref('yj-1', 'outlet'),
      end: ref('out', 'port'),
    },
    {
      id: 'arr-supply',
      layerId: 'deep',
      width: 300,
      points: [ports[5]!.position, t('arr-1', 'dispersed')],
      start: ref('arr-water', 'port'),
      end: ref('arr-1', 'dispersed'),
    },
    {
      id: 'arr-cross',
      layerId: 'deep',
      width: 500,
      points: [ports[6]!.position, t('arr-1', 'continuous')],
      start: ref('arr-oil', 'port'),
      end: ref('arr-1', 'continuous'),
    },
    {
      id: 'arr-drain',
      layerId: 'deep',
      width: 500,
      points: [t('arr-1', 'outlet'), ports[7]!.position],
      start: ref('arr-1', 'outlet'),
      end: ref('arr-out', 'port'),
    },
  ]
  return requireChipDocument({
    version: 1,
    name: 'Mixed junctions (test chip)',
    units: 'um',
    layers: [
      { id: 'ch50', name: 'Channels', depth: 50 },
      { id: 'shallow', name: 'Nozzles', depth: 10 },
      { id: 'deep', name: 'Manifolds', depth: 120 },
    ],
    ports,
    components,
    channels,
    operatingPoints: [
      {
        id: 'op-1',
        name: 'Test point',
        temperatureC: 25,
        continuousLiquid: { liquid: 'n-hexadecane' },
        dispersedLiquid: { liquid: 'water' },
        surfactant: 'sorbitan-monooleate',
        contactAngleDeg: 150,
        inlets: [
          { portId: 'water-in', mode: 'flow', value: 2, unit: 'uL/min' },
          { portId: 'oil-in', mode: 'flow', value: 20, unit: 'uL/min' },
          { portId: 'water2-in', mode: 'flow', value: 60, unit: 'uL/h' },
          { portId: 'water3-in', mode: 'flow', value: 1000, unit: 'nL/min' },
          { portId: 'arr-water', mode: 'pressure', value: 120, unit: 'mbar' },
          { portId: 'arr-oil', mode: 'flow', value: 30, unit: 'uL/min' },
        ],
      },
    ],
    activeOperatingPoint: 'op-1',
  })
}

/** Moves the whole document rigidly: rotate by `deg` about the origin, then translate by `by`. */
export function moveDocument(doc: ChipDocument, deg: number, by: Point): ChipDocument {
  const a = (deg * Math.PI) / 180
  const move = (p: Point): Point => ({
    x: Math.cos(a) * p.x - Math.sin(a) * p.y + by.x,
    y: Math.sin(a) * p.x + Math.cos(a) * p.y + by.y,
  })
  return requireChipDocument({
    ...doc,
    outline: undefined,
    ports: doc.ports.map(p => ({ ...p, position: move(p.position) })),
    channels: doc.channels.map(ch => ({ ...ch, points: ch.points.map(move) })),
    components: doc.components.map(c => ({ ...c, position: move(c.position), rotation: c.rotation + deg })),
    marks: doc.marks.map(m => ({ ...m, position: move(m.position) })),
  })
}

/** Numeric component fields that are not lengths. */
const NOT_LENGTHS = new Set(['rotation', 'angle', 'turns', 'nozzleCount'])

/** Scales every length of the document by k (positions, widths, depths, component parameters). */
export function scaleDocument(doc: ChipDocument, k: number): ChipDocument {
  const scale = (p: Point): Point => ({ x: k * p.x, y: k * p.y })
  return requireChipDocument({
    ...doc,
    outline: undefined,
    marks: [],
    layers: doc.layers.map(l => ({ ...l, depth: k * l.depth })),
    ports: doc.ports.map(p => ({ ...p, position: scale(p.position), punchDiameter: k * p.punchDiameter })),
    channels: doc.channels.map(ch => ({ ...ch, width: k * ch.width, points: ch.points.map(scale) })),
    components: doc.components.map(
      c =>
        Object.fromEntries(
          Object.entries(c).map(([key, v]) => [
            key,
            key === 'position' ? scale(v as Point) : typeof v === 'number' && !NOT_LENGTHS.has(key) ? k * v : v,
          ]),
        ) as unknown as Component,
    ),
  })
}
