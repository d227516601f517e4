// The view state of a chip canvas: size, zoom and pan, with wheel, keyboard and drag handling. Shared by the
// read-only viewer and, later, the editor (which adds tools on top of the same view).
import { ref, shallowRef } from 'vue'
import {
  centreOn,
  fitClearOf,
  fitToBounds,
  panBy,
  screenPoint,
  screenToWorld,
  worldPoint,
  zoomAround,
  type Bounds,
  type View,
  type ViewportSize,
  type WorldPoint,
} from './viewport'

export const ZOOM_STEP = 1.5
/** Space left around the chip by Fit, in CSS pixels. */
export const FIT_MARGIN_PX = 24
const DRAG_THRESHOLD_PX = 3

/**
 * `corner`: the right and bottom edges (CSS px) of a panel floating over the canvas's top-left corner (the layer
 * toggles), which Fit keeps the chip clear of; null when there is none.
 */
export function useChipView(bounds: () => Bounds, corner: () => { width: number; height: number } | null = () => null) {
  const size = ref<ViewportSize>({ width: 800, height: 600 })
  const view = shallowRef<View>(fitToBounds(bounds(), size.value))
  const cursor = shallowRef<WorldPoint | null>(null)
  const panning = ref(false)
  // The view follows Fit (on first layout and on every resize) until the person zooms or pans.
  let following = true

  const fit = () => {
    view.value = fitClearOf(bounds(), size.value, FIT_MARGIN_PX, corner())
    following = true
  }
  /** Fits again after something the fit depends on changed (the corner panel opened or closed), unless the person has zoomed or panned. */
  const refit = () => {
    if (following) fit()
  }
  const moved = (next: View) => {
    view.value = next
    following = false
  }
  const zoomBy = (factor: number, at = screenPoint(size.value.width / 2, size.value.height / 2)) =>
    moved(zoomAround(view.value, factor, at))
  const centre = (x: number, y: number) => moved(centreOn(view.value, worldPoint(x, y), size.value))
  const setView = (v: View) => moved(v)

  /** Fits again when the box is resized, unless the person has zoomed or panned: then the centre stays put. */
  function resize(width: number, height: number) {
    if (width <= 0 || height <= 0) return
    const old = size.value
    if (old.width === width && old.height === height && !following) return
    const mid = screenToWorld(view.value, screenPoint(old.width / 2, old.height / 2))
    size.value = { width, height }
    if (following) fit()
    else view.value = centreOn(view.value, mid, size.value)
  }

  function onWheel(e: WheelEvent, at: { x: number; y: number }) {
    e.preventDefault()
    const lines = e.deltaMode === 1 ? 33 : e.deltaMode === 2 ? size.value.height : 1
    const factor = Math.exp(-e.deltaY * lines * (e.ctrlKey ? 0.01 : 0.0015))
    moved(zoomAround(view.value, factor, screenPoint(at.x, at.y)))
  }

  /** Returns true when the key was a view command. */
  function onKey(e: KeyboardEvent): boolean {
    const stepX = size.value.width * 0.15
    const stepY = size.value.height * 0.15
    const actions: Record<string, () => void> = {
      '+': () => zoomBy(ZOOM_STEP),
      '=': () => zoomBy(ZOOM_STEP),
      '-': () => zoomBy(1 / ZOOM_STEP),
      _: () => zoomBy(1 / ZOOM_STEP),
      '0': fit,
      ArrowLeft: () => moved(panBy(view.value, stepX, 0)),
      ArrowRight: () => moved(panBy(view.value, -stepX, 0)),
      ArrowUp: () => moved(panBy(view.value, 0, stepY)),
      ArrowDown: () => moved(panBy(view.value, 0, -stepY)),
    }
    const act = e.ctrlKey || e.metaKey || e.altKey ? undefined : actions[e.key]
    if (!act) return false
    e.preventDefault()
    act()
    return true
  }

  // Drag to pan. A press that moves less than a few pixels is a click.
  let press: { x: number; y: number; view: View } | null = null
  function pointerDown(at: { x: number; y: number }) {
    press = { ...at, view: view.value }
    panning.value = false
  }
  function pointerMove(at: { x: number; y: number }) {
    cursor.value = screenToWorld(view.value, screenPoint(at.x, at.y))
    if (!press) return
    const dx = at.x - press.x
    const dy = at.y - press.y
    if (!panning.value && Math.hypot(dx, dy) < DRAG_THRESHOLD_PX) return
    panning.value = true
    moved(panBy(press.view, dx, dy))
  }
  /** Ends a press; returns true when it was a click (no pan). */
  function pointerUp(): boolean {
    const click = press !== null && !panning.value
    press = null
    panning.value = false
    return click
  }

  return {
    size,
    view,
    cursor,
    panning,
    fit,
    refit,
    zoomBy,
    centre,
    setView,
    resize,
    onWheel,
    onKey,
    pointerDown,
    pointerMove,
    pointerUp,
  }
}
