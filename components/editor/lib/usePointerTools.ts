// Pointer handling for the editor canvas: select (click, shift-click, box), drag to move with snapping, draw a
// channel point by point (snapping to terminals, then the grid), reshape a selected channel (drag its handles,
// double-click to add or remove a bend), place parts and ports, measure. Emits intents;
// the store turns them into named actions. Nothing here changes the document.
import { ref, shallowRef, type Ref, type ShallowRef } from 'vue'
import type { ChipDocument, TerminalRef } from '~~/shared/schemas/chip'
import { snapDelta, snapPoint, snapToGrid, pivotOf, type PointUm, type PlaceableKind } from '~~/shared/editor'
import { hitTest } from '../../viewer/lib/hitTest'
import type { ChipScene } from '../../viewer/lib/scene'
import { screenPoint, screenToWorld, type View } from '../../viewer/lib/viewport'
import type { Tool } from './tools'
import { useChannelHandles } from './channelHandles'

export interface CanvasIntents {
  select: (ids: string[], mode: 'replace' | 'toggle' | 'add') => void
  move: (ids: string[], dx: number, dy: number) => void
  channel: (points: PointUm[], start?: TerminalRef, end?: TerminalRef) => void
  place: (kind: PlaceableKind, at: PointUm) => void
  port: (kind: 'inlet' | 'outlet', phase: 'continuous' | 'dispersed' | undefined, at: PointUm) => void
  mark: (at: PointUm) => void
  /** A bend inserted into a channel, a point of it moved (an end dropped on a terminal attaches), a bend removed. */
  bend: (id: string, at: PointUm) => void
  vertex: (id: string, index: number, at: PointUm, attach?: TerminalRef) => void
  unbend: (id: string, index: number) => void
}

interface Ctx {
  scene: () => ChipScene
  doc: () => ChipDocument
  view: ShallowRef<View>
  tool: () => Tool
  selection: () => string[]
  pitch: () => number
  visibleLayers: () => ReadonlySet<string>
  emit: CanvasIntents
}

const DRAG_PX = 3
const SNAP_PX = 14

export function usePointerTools(c: Ctx) {
  const drag = shallowRef<{ ids: string[]; delta: PointUm } | null>(null)
  const box = shallowRef<{ a: { x: number; y: number }; b: { x: number; y: number }; mode: 'replace' | 'add' } | null>(
    null,
  )
  const draft = ref<PointUm[]>([])
  let draftStart: TerminalRef | undefined
  const snapped = shallowRef<PointUm | null>(null)
  const measure = shallowRef<{ a: PointUm; b: PointUm | null } | null>(null)
  const hoverId: Ref<string | null> = ref(null)
  let press: { screen: { x: number; y: number }; world: PointUm; anchor: PointUm; ids: string[] } | null = null

  const world = (s: { x: number; y: number }) => screenToWorld(c.view.value, screenPoint(s.x, s.y))
  const hit = (p: PointUm) =>
    hitTest(c.scene().index, p.x, p.y, { toleranceUm: 4 / c.view.value.scale, layerIds: c.visibleLayers() })
  const snap = (p: PointUm) => snapPoint(c.doc(), p, { pitch: c.pitch(), terminalRadius: SNAP_PX / c.view.value.scale })
  const handles = useChannelHandles({
    doc: c.doc,
    view: c.view,
    selection: c.selection,
    pitch: c.pitch,
    snap,
    dragPx: DRAG_PX,
  })

  function down(s: { x: number; y: number }, shift: boolean) {
    const p = world(s)
    const tool = c.tool()
    if (tool === 'select') {
      if (!shift && handles.take(s)) return
      const id = hit(p)
      if (!id) {
        box.value = { a: s, b: s, mode: shift ? 'add' : 'replace' }
        return
      }
      if (shift) {
        c.emit.select([id], 'toggle')
        return
      }
      const ids = c.selection().includes(id) ? c.selection() : [id]
      if (!c.selection().includes(id)) c.emit.select([id], 'replace')
      press = { screen: s, world: p, anchor: pivotOf(c.doc(), ids), ids }
    } else if (tool === 'channel') {
      const { point, terminal } = snap(p)
      if (draft.value.length === 0) draftStart = terminal?.ref
      draft.value = [...draft.value, point]
      if (terminal && draft.value.length >= 2) finishChannel(terminal.ref)
    } else if (tool === 'measure') {
      const { point } = snap(p)
      measure.value = !measure.value || measure.value.b ? { a: point, b: null } : { a: measure.value.a, b: point }
    } else if (tool.startsWith('place:')) {
      c.emit.place(tool.slice(6) as PlaceableKind, snapToGrid(p, c.pitch()))
    } else if (tool === 'mark') {
      c.emit.mark(snapToGrid(p, c.pitch()))
    } else if (tool.startsWith('port:')) {
      const which = tool.slice(5)
      c.emit.port(
        which === 'outlet' ? 'outlet' : 'inlet',
        which === 'outlet' ? undefined : (which as 'continuous' | 'dispersed'),
        snapToGrid(p, c.pitch()),
      )
    }
  }

  function moveTo(s: { x: number; y: number }) {
    const p = world(s)
    const held = handles.drag(s, p)
    if (held.holding) {
      snapped.value = held.snapped
      return
    }
    if (press) {
      const far = Math.hypot(s.x - press.screen.x, s.y - press.screen.y) >= DRAG_PX
      if (far || drag.value)
        drag.value = {
          ids: press.ids,
          delta: snapDelta(press.anchor, p.x - press.world.x, p.y - press.world.y, c.pitch()),
        }
      return
    }
    if (box.value) {
      box.value = { ...box.value, b: s }
      return
    }
    const tool = c.tool()
    if (tool === 'channel' || tool === 'measure') {
      const r = snap(p)
      snapped.value = r.terminal ? r.point : null
      if (tool === 'measure' && measure.value && !measure.value.b) measure.value = { a: measure.value.a, b: null }
      rubber.value = r.point
    } else {
      hoverId.value = tool === 'select' ? hit(p) : null
      rubber.value = null
    }
  }
  const rubber = shallowRef<PointUm | null>(null)

  function up() {
    const h = handles.release()
    if (h.held) {
      snapped.value = null
      if (h.moved) c.emit.vertex(h.moved.id, h.moved.index, h.moved.point, h.moved.attach)
      return
    }
    if (press) {
      const d = drag.value
      press = null
      drag.value = null
      if (d && (d.delta.x !== 0 || d.delta.y !== 0)) c.emit.move(d.ids, d.delta.x, d.delta.y)
      return
    }
    if (box.value) {
      const { a, b, mode } = box.value
      box.value = null
      if (Math.hypot(a.x - b.x, a.y - b.y) < DRAG_PX) {
        if (mode === 'replace') c.emit.select([], 'replace')
        return
      }
      c.emit.select(elementsInBox(c.scene(), world(a), world(b), c.visibleLayers()), mode)
    }
  }

  /** Double-click: finish a channel being drawn; with the select tool, remove the bend under a handle or add one on a channel. */
  function doubleClick(s: { x: number; y: number }) {
    if (c.tool() === 'channel') {
      finishChannel()
      return
    }
    if (c.tool() !== 'select') return
    const handle = handles.handleAt(s)
    const ch = handle && c.doc().channels.find(x => x.id === handle.id)
    if (handle && ch) {
      if (handle.index > 0 && handle.index < ch.points.length - 1) c.emit.unbend(handle.id, handle.index)
      return
    }
    const p = world(s)
    const id = hit(p)
    if (id && c.doc().channels.some(x => x.id === id)) c.emit.bend(id, snapToGrid(p, c.pitch()))
  }

  function finishChannel(end?: TerminalRef) {
    const pts = draft.value
    if (pts.length >= 2) c.emit.channel(pts, draftStart, end)
    draft.value = []
    draftStart = undefined
  }
  /** Esc / Enter: finish a channel of ≥ 2 points, else cancel what is under way. Returns true when it did something. */
  function escape(): boolean {
    if (draft.value.length) {
      finishChannel()
      return true
    }
    if (measure.value) {
      measure.value = null
      return true
    }
    if (press || drag.value) {
      press = null
      drag.value = null
      return true
    }
    if (handles.cancel()) return true
    return false
  }
  const reset = () => {
    draft.value = []
    draftStart = undefined
    measure.value = null
    snapped.value = null
    rubber.value = null
  }

  return {
    drag,
    box,
    draft,
    snapped,
    measure,
    hoverId,
    rubber,
    vertex: handles.vertex,
    down,
    moveTo,
    up,
    escape,
    finishChannel,
    doubleClick,
    reset,
  }
}

/** Ids of elements lying wholly inside the box spanned by two world points. */
export function elementsInBox(scene: ChipScene, a: PointUm, b: PointUm, layers: ReadonlySet<string>): string[] {
  const minX = Math.min(a.x, b.x),
    maxX = Math.max(a.x, b.x),
    minY = Math.min(a.y, b.y),
    maxY = Math.max(a.y, b.y)
  const outside = new Set<string>()
  const inside = new Set<string>()
  for (const e of scene.elements) {
    if (!layers.has(e.layerId)) continue
    for (const poly of e.pieces)
      for (const [x, y] of poly[0] ?? []) {
        if (x < minX || x > maxX || y < minY || y > maxY) {
          outside.add(e.elementId)
          break
        }
      }
    inside.add(e.elementId)
  }
  return [...inside].filter(id => !outside.has(id))
}
