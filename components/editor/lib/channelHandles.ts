// Handles on the points of the one selected channel: find the handle under the pointer, drag it (a bend snaps to
// the grid, an end to a terminal it can attach to, else the grid) and hand back the move on release.
import { shallowRef, type ShallowRef } from 'vue'
import type { ChipDocument, TerminalRef } from '~~/shared/schemas/chip'
import { snapToGrid, type PointUm, type TerminalHit } from '~~/shared/editor'
import type { View } from '../../viewer/lib/viewport'

/** How near (px) a press must be to a channel point to take its handle. */
export const HANDLE_PX = 7

export interface VertexDrag {
  id: string
  index: number
  point: PointUm
  attach?: TerminalRef
}

interface Deps {
  doc: () => ChipDocument
  view: ShallowRef<View>
  selection: () => string[]
  pitch: () => number
  snap: (p: PointUm) => { point: PointUm; terminal: TerminalHit | null }
  dragPx: number
}

export function useChannelHandles(c: Deps) {
  const vertex = shallowRef<VertexDrag | null>(null)
  let press: { id: string; index: number; screen: { x: number; y: number } } | null = null

  /** The selected channel (only one selected) and the index of its point under screen point s, if any. */
  function handleAt(s: { x: number; y: number }): { id: string; index: number } | null {
    const sel = c.selection()
    const ch = sel.length === 1 ? c.doc().channels.find(x => x.id === sel[0]) : undefined
    if (!ch) return null
    const v = c.view.value
    const index = ch.points.findIndex(
      q => Math.hypot(v.tx + q.x * v.scale - s.x, v.ty - q.y * v.scale - s.y) <= HANDLE_PX,
    )
    return index >= 0 ? { id: ch.id, index } : null
  }
  /** A press on a handle takes it; returns false when there is none under the pointer. */
  function take(s: { x: number; y: number }): boolean {
    const h = handleAt(s)
    press = h ? { ...h, screen: s } : null
    return !!h
  }
  /** Pointer moved while a handle is held: returns the terminal snapped onto (for the ring), if any. Null when not holding. */
  function drag(s: { x: number; y: number }, p: PointUm): { holding: boolean; snapped: PointUm | null } {
    if (!press) return { holding: false, snapped: null }
    if (!vertex.value && Math.hypot(s.x - press.screen.x, s.y - press.screen.y) < c.dragPx)
      return { holding: true, snapped: null }
    const ch = c.doc().channels.find(x => x.id === press!.id)
    const end = !!ch && (press.index === 0 || press.index === ch.points.length - 1)
    const r = end ? c.snap(p) : { point: snapToGrid(p, c.pitch()), terminal: null }
    vertex.value = {
      id: press.id,
      index: press.index,
      point: r.point,
      ...(r.terminal ? { attach: r.terminal.ref } : {}),
    }
    return { holding: true, snapped: r.terminal ? r.point : null }
  }
  /** Release: the finished drag, or null (no handle held, or it did not move). */
  function release(): { held: boolean; moved: VertexDrag | null } {
    const held = !!press
    const moved = vertex.value
    press = null
    vertex.value = null
    return { held, moved }
  }
  const cancel = (): boolean => {
    const was = !!press || !!vertex.value
    press = null
    vertex.value = null
    return was
  }

  return { vertex, handleAt, take, drag, release, cancel }
}
