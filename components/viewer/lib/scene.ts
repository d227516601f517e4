// The drawable scene of one chip document, built once per document and memoised: per-layer rings with a
// consistent winding (so one non-zero fill per layer draws the union of its pieces without seams), marks, text,
// ports, the chip edge, the bounds and the hit-test index. Pure: no canvas, no Vue.
import type { ChipDocument } from '#shared/schemas/chip'
import { kindLabel } from '#shared/utils/junctionKinds'
import { chipOutlineRing, documentPieces, MARKS_LAYER } from '~~/geometry/outlines/elements'
import type { ElementKind, GeometryProblem, Pair, Polygon } from '~~/geometry/types'
import { buildElementIndex, signedArea, type ElementIndex } from './hitTest'
import { layerStyles, type LayerStyle } from './palette'
import { emptyBounds, extend, isEmpty, type Bounds } from './viewport'

export interface SceneLayer {
  layerId: string
  name: string
  /** µm */
  depth: number
  style: LayerStyle
  /** Rings as flat [x0, y0, x1, y1, …] µm: exteriors counter-clockwise, holes clockwise. */
  rings: Float64Array[]
  /** The same rings in runs of neighbouring elements with their box, for culling and level of detail (draw.ts). */
  chunks: SceneChunk[]
}

/** A run of consecutive elements' rings on one layer: drawn, culled and simplified together. */
export interface SceneChunk {
  rings: Float64Array[]
  /** µm */
  box: Bounds
  /** The largest side of any of its rings' boxes, µm: below a few pixels the chunk is drawn simplified. */
  maxSide: number
}

export interface ScenePort {
  id: string
  kind: 'inlet' | 'outlet'
  phase?: 'continuous' | 'dispersed'
  x: number
  y: number
  radius: number
}
export interface SceneText {
  id: string
  text: string
  x: number
  y: number
  height: number
}
export interface SceneElement {
  elementId: string
  kind: ElementKind
  layerId: string
  pieces: Polygon[]
}

export interface ChipScene {
  /** Channel layers, deepest first (the drawing order: shallow features sit on top). */
  layers: SceneLayer[]
  /** Alignment marks (their own layer). */
  marks: Float64Array[]
  markChunks: SceneChunk[]
  texts: SceneText[]
  ports: ScenePort[]
  chipOutline: Pair[] | null
  elements: SceneElement[]
  index: ElementIndex
  bounds: Bounds
  problems: GeometryProblem[]
  /** A short description per element id for hover text: `tj-1 · T-junction`. */
  titles: Map<string, string>
}

/** Arc chord tolerance for the viewer (µm); the mask export uses 0.1 µm, the screen needs less. */
const TOLERANCE = 0.5

const cache = new WeakMap<ChipDocument, ChipScene>()

/** The scene for a document, built once per document object. */
export function sceneFor(doc: ChipDocument): ChipScene {
  let s = cache.get(doc)
  if (!s) {
    s = buildScene(doc)
    cache.set(doc, s)
  }
  return s
}

/** What one document element draws: its pieces per layer, flat rings and box per layer, its drawing problems. */
interface ElementBuild {
  parts: ElementPart[]
  problems: GeometryProblem[]
}
interface ElementPart {
  element: SceneElement
  rings: Float64Array[]
  box: Bounds
  maxSide: number
}

/**
 * Per document element (channel, component, port, mark object), what it draws. The editor changes a document by
 * copying only the elements an edit touches (shared/editor), so after an edit every other element is the same
 * object and its outline, rings and box are reused: a nozzle moved on a 4,096-nozzle chip strokes one nozzle and
 * its two channels, not 16 000 pieces.
 */
const built = new WeakMap<object, ElementBuild>()
const EMPTY: Pick<ChipDocument, 'channels' | 'components' | 'ports' | 'marks'> = {
  channels: [],
  components: [],
  ports: [],
  marks: [],
}

function elementBuild(
  doc: ChipDocument,
  collection: 'channels' | 'components' | 'ports' | 'marks',
  element: object,
): ElementBuild {
  let b = built.get(element)
  if (!b) {
    const one = { ...doc, ...EMPTY, [collection]: [element] } as ChipDocument
    const { elements, problems } = documentPieces(one, TOLERANCE)
    b = { problems, parts: elements.map(e => part(e)) }
    built.set(element, b)
  }
  return b
}

function part(element: SceneElement): ElementPart {
  const box = emptyBounds()
  const rings: Float64Array[] = []
  let maxSide = 0
  for (const piece of element.pieces) {
    piece.forEach((ring, i) => {
      const rb = emptyBounds()
      rings.push(flatRing(ring, i === 0, rb))
      if (i === 0) maxSide = Math.max(maxSide, rb.maxX - rb.minX, rb.maxY - rb.minY)
      extend(box, rb.minX, rb.minY)
      extend(box, rb.maxX, rb.maxY)
    })
  }
  return { element, rings, box, maxSide }
}

/** Rings per chunk: large enough that a chip is a few hundred fills, small enough that culling pays. */
const CHUNK_RINGS = 256
const chunkCache = new WeakMap<ElementPart, { members: ElementPart[]; chunk: SceneChunk }>()

/** Consecutive parts of one layer in chunks of about CHUNK_RINGS rings; a chunk whose parts are unchanged is reused. */
function chunksOf(parts: ElementPart[]): SceneChunk[] {
  const out: SceneChunk[] = []
  let i = 0
  while (i < parts.length) {
    const cached = chunkCache.get(parts[i]!)
    if (cached && cached.members.every((m, k) => parts[i + k] === m)) {
      out.push(cached.chunk)
      i += cached.members.length
      continue
    }
    const members: ElementPart[] = []
    let n = 0
    while (i < parts.length && (n === 0 || n + parts[i]!.rings.length <= CHUNK_RINGS)) {
      members.push(parts[i]!)
      n += parts[i]!.rings.length
      i++
    }
    const box = emptyBounds()
    let maxSide = 0
    for (const m of members) {
      if (m.rings.length) {
        extend(box, m.box.minX, m.box.minY)
        extend(box, m.box.maxX, m.box.maxY)
      }
      maxSide = Math.max(maxSide, m.maxSide)
    }
    const chunk = { rings: members.flatMap(m => m.rings), box, maxSide }
    chunkCache.set(members[0]!, { members, chunk })
    out.push(chunk)
  }
  return out
}

export function buildScene(doc: ChipDocument): ChipScene {
  // The per-element pieces of buildOutlines(doc).elements, without the per-layer union the mask needs, in the
  // order documentPieces gives them (channels, components, ports, marks).
  const elements: SceneElement[] = []
  const problems: GeometryProblem[] = []
  const partsByLayer = new Map<string, ElementPart[]>()
  const bounds = emptyBounds()
  for (const collection of ['channels', 'components', 'ports', 'marks'] as const) {
    for (const element of doc[collection]) {
      const b = elementBuild(doc, collection, element)
      problems.push(...b.problems)
      for (const p of b.parts) {
        elements.push(p.element)
        const list = partsByLayer.get(p.element.layerId) ?? []
        list.push(p)
        partsByLayer.set(p.element.layerId, list)
        if (p.rings.length) {
          extend(bounds, p.box.minX, p.box.minY)
          extend(bounds, p.box.maxX, p.box.maxY)
        }
      }
    }
  }
  const styles = layerStyles(doc.layers)
  const chipOutline = chipOutlineRing(doc)
  for (const [x, y] of chipOutline ?? []) extend(bounds, x, y)
  const texts = doc.marks.flatMap(m =>
    m.kind === 'text' ? [{ id: m.id, text: m.text, x: m.position.x, y: m.position.y, height: m.height }] : [],
  )
  for (const t of texts) {
    extend(bounds, t.x, t.y)
    extend(bounds, t.x + t.height * 0.6 * t.text.length, t.y + t.height)
  }
  if (isEmpty(bounds)) Object.assign(bounds, { minX: 0, minY: 0, maxX: 1000, maxY: 1000 })

  const ringsOf = (parts: ElementPart[] | undefined) => (parts ?? []).flatMap(p => p.rings)
  const layers = [...doc.layers]
    .sort((a, b) => b.depth - a.depth)
    .map(l => ({
      layerId: l.id,
      name: l.name,
      depth: l.depth,
      style: styles.get(l.id)!,
      rings: ringsOf(partsByLayer.get(l.id)),
      chunks: chunksOf(partsByLayer.get(l.id) ?? []),
    }))
  const ports = doc.ports.map(p => ({
    id: p.id,
    kind: p.kind,
    phase: p.feed?.phase,
    x: p.position.x,
    y: p.position.y,
    radius: p.punchDiameter / 2,
  }))
  return {
    layers,
    marks: ringsOf(partsByLayer.get(MARKS_LAYER)),
    markChunks: chunksOf(partsByLayer.get(MARKS_LAYER) ?? []),
    texts,
    ports,
    chipOutline,
    elements,
    index: buildElementIndex(elements.filter(e => e.layerId !== MARKS_LAYER)),
    bounds,
    problems,
    titles: titles(doc),
  }
}

function titles(doc: ChipDocument): Map<string, string> {
  const m = new Map<string, string>()
  for (const c of doc.components)
    m.set(c.id, `${c.id} · ${c.kind === 'serpentine' ? 'serpentine' : kindLabel(c.kind, 'inline')}`)
  for (const c of doc.channels) m.set(c.id, `${c.id} · channel, ${c.width} µm wide`)
  for (const p of doc.ports)
    m.set(p.id, `${p.id} · ${p.kind}${p.feed ? ` (${p.feed.phase} phase)` : ''}, ${p.punchDiameter} µm punch`)
  return m
}

/** A ring as a flat array, exteriors turned counter-clockwise and holes clockwise; grows `bounds`. */
export function flatRing(ring: Pair[], exterior: boolean, bounds?: Bounds): Float64Array {
  const ccw = signedArea(ring) >= 0
  const n =
    ring.length > 1 && ring[0]![0] === ring[ring.length - 1]![0] && ring[0]![1] === ring[ring.length - 1]![1]
      ? ring.length - 1
      : ring.length
  const out = new Float64Array(n * 2)
  const reverse = ccw !== exterior
  for (let i = 0; i < n; i++) {
    const [x, y] = ring[reverse ? n - 1 - i : i]!
    out[2 * i] = x
    out[2 * i + 1] = y
    if (bounds) extend(bounds, x, y)
  }
  return out
}

export { MARKS_LAYER }

const elementRingCache = new WeakMap<ChipScene, Map<string, Float64Array[]>>()

/** The rings of one element on every layer it draws on (for hover and selection outlines), memoised. */
export function elementRings(scene: ChipScene, elementId: string): Float64Array[] {
  let m = elementRingCache.get(scene)
  if (!m) {
    m = new Map()
    elementRingCache.set(scene, m)
  }
  let r = m.get(elementId)
  if (!r) {
    r = scene.elements
      .filter(e => e.elementId === elementId && e.layerId !== MARKS_LAYER)
      .flatMap(e => e.pieces.flatMap(poly => poly.map((ring, i) => flatRing(ring, i === 0))))
    m.set(elementId, r)
  }
  return r
}
