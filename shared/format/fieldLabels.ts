// Schema paths in people's words: `components.0.mainWidth` → T-junction "tj-1", Main channel width. The API keeps
// its paths (for scripts); every screen a person reads goes through these helpers. Pure: no Vue, no I/O.
import { JUNCTION_KIND_LABELS } from '../utils/junctionKinds'

/** What each kind of element is called on screen. */
export const KIND_NAMES: Record<string, string> = {
  ...JUNCTION_KIND_LABELS,
  serpentine: 'Serpentine',
  filter: 'Filter',
  cross: 'Alignment cross',
  text: 'Text',
  inlet: 'Inlet',
  outlet: 'Outlet',
}

const COLLECTION_NAMES: Record<string, string> = {
  layers: 'Layer',
  ports: 'Port',
  channels: 'Channel',
  components: 'Part',
  marks: 'Mark',
  operatingPoints: 'Operating point',
  outline: 'Chip outline',
  document: 'Design',
}

/** Field keys (the last named step of a path) → the label the inspector uses for them. */
export const FIELD_LABELS: Record<string, string> = {
  'position.x': 'x position',
  'position.y': 'y position',
  rotation: 'Rotation',
  x: 'x',
  y: 'y',
  mainWidth: 'Main channel width',
  inletWidth: 'Side inlet width',
  armLength: 'Arm length',
  orificeWidth: 'Orifice width',
  orificeLength: 'Orifice length',
  continuousWidth: 'Continuous arm width',
  dispersedWidth: 'Dispersed inlet width',
  outletWidth: 'Outlet width',
  angle: 'Angle between arms',
  nozzleWidth: 'Nozzle width',
  nozzleLength: 'Nozzle length',
  reservoirWidth: 'Reservoir width',
  reservoirLength: 'Reservoir length',
  nozzleCount: 'Nozzles',
  pitch: 'Pitch',
  supplyWidth: 'Supply width',
  margin: 'End margin',
  turns: 'Turns',
  width: 'Width',
  totalLength: 'Total length',
  punchDiameter: 'Punch diameter',
  size: 'Size',
  lineWidth: 'Line width',
  height: 'Text height',
  depth: 'Depth',
  layerId: 'Layer',
  points: 'Points',
  kind: 'Kind',
  feed: 'Feed',
  'feed.phase': 'Phase fed',
  name: 'Name',
  id: 'Name',
  inlets: 'Inlet settings',
  value: 'Set value',
  unit: 'Unit',
  mode: 'Driven by',
  portId: 'Inlet',
  temperatureC: 'Temperature',
  continuousLiquid: 'Continuous liquid',
  dispersedLiquid: 'Dispersed liquid',
  surfactant: 'Surfactant',
  interfacialTensionMNPerM: 'Interfacial tension',
  contactAngleDeg: 'Contact angle',
  massFraction: 'Mass fraction',
  liquid: 'Liquid',
  activeOperatingPoint: 'Active operating point',
  version: 'Document version',
  units: 'Drawing units',
  outline: 'Chip outline',
  text: 'Text',
  layers: 'Layers',
  terminals: 'Connections',
  // A fabrication process's design-rule values (shared/schemas/libraries.ts).
  minFeature: 'Smallest feature',
  minGap: 'Smallest gap',
  minDepth: 'Smallest depth',
  maxDepth: 'Largest depth',
  maxWidthToDepth: 'Largest width/depth ratio',
  maxWallDepthToWidth: 'Largest wall depth/width ratio',
  portEdgeDistance: 'Port to chip edge',
  portSpacing: 'Port spacing',
  bondPressureLimitMbar: 'Bond pressure limit',
}

/** Splits "document.ports[0].x", "ports.0.x" or ["ports", 0, "x"] into steps. */
export function pathSteps(path: string | readonly PropertyKey[]): Array<string | number> {
  const raw =
    typeof path === 'string'
      ? path
          .replace(/\[(\d+)\]/g, '.$1')
          .split('.')
          .filter(Boolean)
      : path.map(p => (typeof p === 'symbol' ? String(p.description) : p))
  const steps = raw.map(s => (typeof s === 'string' && /^\d+$/.test(s) ? Number(s) : s))
  return steps[0] === 'document' ? steps.slice(1) : steps
}

type Doc = Record<string, unknown> | null | undefined
interface ElementLike {
  id?: unknown
  kind?: unknown
  name?: unknown
  portId?: unknown
}

/** Collections whose elements carry a name of their own beside the id (a channel's is optional). */
const NAMED = new Set(['operatingPoints', 'layers', 'channels'])
const ownName = (collection: string, el: ElementLike | undefined): string | null =>
  NAMED.has(collection) && typeof el?.name === 'string' && el.name.trim() !== ''
    ? el.name
    : typeof el?.id === 'string' && el.id !== ''
      ? el.id
      : null

/** "T-junction “tj-1”", "Inlet “oil-in”", "Operating point “Day 1”": the kind and the element's own name. */
export function elementName(collection: string, el: ElementLike | undefined, index?: number): string {
  const kind = typeof el?.kind === 'string' ? KIND_NAMES[el.kind] : undefined
  const noun = kind ?? COLLECTION_NAMES[collection] ?? collection
  const own = ownName(collection, el)
  if (own) return `${noun} “${own}”`
  return index === undefined ? noun : `${noun} ${index + 1}`
}

/** The label of a field path inside an element ("position.x" → "x position", "inlets.2.value" → "Inlet “water-in”, set value"). */
function fieldLabel(steps: Array<string | number>, el: unknown): string {
  if (!steps.length) return ''
  const dotted = steps.filter(s => typeof s === 'string').join('.')
  if (FIELD_LABELS[dotted]) return FIELD_LABELS[dotted]!
  const head = steps[0]!
  if (typeof head === 'string' && typeof steps[1] === 'number') {
    // A list inside an element: the inlets of an operating point name their port, points are numbered.
    const item = ((el as Record<string, unknown> | undefined)?.[head] as ElementLike[] | undefined)?.[steps[1]]
    const what =
      head === 'inlets'
        ? `Inlet “${typeof item?.portId === 'string' ? item.portId : steps[1] + 1}”`
        : head === 'points'
          ? `Point ${steps[1] + 1}`
          : `${FIELD_LABELS[head] ?? head} ${steps[1] + 1}`
    const rest = fieldLabel(steps.slice(2), item)
    return rest ? `${what}, ${rest.charAt(0).toLowerCase()}${rest.slice(1)}` : what
  }
  const last = [...steps].reverse().find(s => typeof s === 'string') as string | undefined
  return (last && FIELD_LABELS[last]) ?? (last ? last.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase() : '')
}

/** Where a path points, in people's words: "T-junction “tj-1” · Main channel width". */
export function describePath(path: string | readonly PropertyKey[], doc?: Doc): { element: string; field: string } {
  const steps = pathSteps(path)
  const [collection, index] = steps
  if (typeof collection === 'string' && typeof index === 'number' && collection in COLLECTION_NAMES) {
    const el = (doc?.[collection] as ElementLike[] | undefined)?.[index]
    return { element: elementName(collection, el, index), field: fieldLabel(steps.slice(2), el) }
  }
  if (collection === 'outline') return { element: 'Chip outline', field: fieldLabel(steps.slice(1), doc?.outline) }
  return { element: 'Design', field: fieldLabel(steps, doc) }
}

export const describePathText = (path: string | readonly PropertyKey[], doc?: Doc): string => {
  const { element, field } = describePath(path, doc)
  return field ? `${element} · ${field}` : element
}

/**
 * A schema message for a person: zod's own wording ("Invalid input: expected string, received undefined") becomes
 * what to do, and the trailing location the core adds for the API (`on component "tj-1" at terminals.0`) is dropped
 * because the screen names the element and the field beside it.
 */
export function plainMessage(message: string): string {
  return message
    .replace(/^Invalid input: expected (\w+), received (undefined|null)$/i, 'Missing: enter a value')
    .replace(/^Invalid input: expected number, received (\w+)$/i, 'Enter a number')
    .replace(/^Invalid input: expected string, received (\w+)$/i, 'Enter text')
    .replace(/^Invalid input: expected (\w+), received (\w+)$/i, 'Not the expected kind of value ($1)')
    .replace(
      /^Invalid option: expected one of (.+)$/i,
      (_m, list: string) => `Choose one of ${list.replace(/\|/g, ', ')}`,
    )
    .replace(
      /^Unrecognized keys?: (.+)$/i,
      (_m, keys: string) =>
        `Unknown field${keys.includes(',') ? 's' : ''} ${keys} (remove ${keys.includes(',') ? 'them' : 'it'})`,
    )
    .replace(/\s*\((got (nothing|undefined))\)/, '')
    .replace(/ on [a-z -]+ "[^"]*"( at [\w.[\]]+)?$/i, '')
    .replace(/ at [\w.[\]]+$/, '')
}

/** A document problem as a person reads it: where (element and field), then what to do. */
export function peopleError(e: { path: string; message: string }, doc?: Doc): string {
  const where = e.path ? describePathText(e.path, doc) : 'Design'
  return `${where}: ${plainMessage(e.message)}`
}

/** The label of a field path inside one element ("position.x" → "x position", "mainWidth" → "Main channel width"). */
export const labelField = (path: string, el?: unknown): string => fieldLabel(pathSteps(path), el)

/** An element of the document by its id, named as on screen ("T-junction “tj-1”"); the bare id when it is not found. */
export function nameOfId(doc: Doc, id: string): string {
  for (const collection of ['components', 'ports', 'channels', 'marks', 'layers', 'operatingPoints']) {
    const el = (doc?.[collection] as ElementLike[] | undefined)?.find(e => e?.id === id)
    if (el) return elementName(collection, el)
  }
  return id === 'outline' ? 'Chip outline' : id
}

/**
 * A message from the rules or the core with the ids it quotes (`Operating point "op-1"`, `layer "ch25"`) replaced by
 * the element's own name (`Operating point “Beads at 4:1 oil”`, `layer “Channels”`) where it has one. Ids of
 * elements without a name of their own (parts, ports) are their name and stay as they are.
 */
export function namedMessage(doc: Doc, message: string): string {
  return message.replace(/"([^"\s]{1,64})"/g, (whole, id: string) => {
    for (const collection of NAMED) {
      const el = (doc?.[collection] as ElementLike[] | undefined)?.find(e => e?.id === id)
      if (el) {
        const own = ownName(collection, el)
        return own && own !== id ? `“${own}”` : whole
      }
    }
    return whole
  })
}

/** Units of the document's numeric fields by their key, as the chip document stores them (lengths in µm). */
const FIELD_UNITS: Record<string, string> = {
  rotation: '°',
  angle: '°',
  contactAngleDeg: '°',
  temperatureC: '°C',
  interfacialTensionMNPerM: 'mN/m',
  viscosityMPaS: 'mPa·s',
  densityKgPerM3: 'kg/m³',
  nozzleCount: '',
  turns: '',
  massFraction: '',
  version: '',
}
/** The unit of a field path ("mainWidth" → "µm", "rotation" → "°"); '' for a plain count or fraction. */
export function fieldUnit(path: string): string {
  const last = [...pathSteps(path)].reverse().find(s => typeof s === 'string') as string | undefined
  if (!last) return ''
  return FIELD_UNITS[last] ?? 'µm'
}

/** A junction as the drawing names it: "T-junction “tj-1”"; a nozzle of an array "Step nozzle array “arr-1”, nozzle 4" (from 1 along its manifold). */
export function junctionName(doc: Doc, id: string): string {
  const nozzle = /^(.*)\[(\d+)\]$/.exec(id)
  if (nozzle) return `${nameOfId(doc, nozzle[1]!)}, nozzle ${Number(nozzle[2]) + 1}`
  return nameOfId(doc, id)
}
