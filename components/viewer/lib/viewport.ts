// Viewport maths for the chip canvas. The document (world) frame is µm with x right and y UP, as in the mask
// DXF; the screen is CSS pixels with y DOWN. The flip happens here and nowhere else:
//   screen.x = tx + scale · world.x        screen.y = ty − scale · world.y
// Branded points keep the two spaces from being mixed up.

export type WorldPoint = { readonly x: number; readonly y: number } & { readonly __space: 'world-µm' }
export type ScreenPoint = { readonly x: number; readonly y: number } & { readonly __space: 'screen-px' }

export const worldPoint = (x: number, y: number): WorldPoint => ({ x, y }) as WorldPoint
export const screenPoint = (x: number, y: number): ScreenPoint => ({ x, y }) as ScreenPoint

/** `scale` is CSS pixels per micrometre; (tx, ty) is where the world origin lands on the screen. */
export interface View {
  readonly scale: number
  readonly tx: number
  readonly ty: number
}

/** An axis-aligned box in world µm. */
export interface Bounds {
  minX: number
  minY: number
  maxX: number
  maxY: number
}

export interface ViewportSize {
  width: number
  height: number
}

/** Zoom limits: 1 px = 10 mm at the widest, 1 px = 5 nm at the closest. */
export const MIN_SCALE = 1e-4
export const MAX_SCALE = 200

export const clampScale = (s: number): number => Math.min(MAX_SCALE, Math.max(MIN_SCALE, s))

export function worldToScreen(view: View, p: WorldPoint): ScreenPoint {
  return screenPoint(view.tx + view.scale * p.x, view.ty - view.scale * p.y)
}

export function screenToWorld(view: View, p: ScreenPoint): WorldPoint {
  return worldPoint((p.x - view.tx) / view.scale, (view.ty - p.y) / view.scale)
}

/**
 * The view that shows `bounds` whole and centred in a viewport of `viewportPx`, leaving `margin` CSS pixels
 * on every side. Empty or degenerate bounds are widened to 1 µm so the result is always finite.
 */
export function fitToBounds(bounds: Bounds, viewportPx: ViewportSize, margin = 24): View {
  const w = Math.max(bounds.maxX - bounds.minX, 1)
  const h = Math.max(bounds.maxY - bounds.minY, 1)
  const availW = Math.max(viewportPx.width - 2 * margin, 1)
  const availH = Math.max(viewportPx.height - 2 * margin, 1)
  const scale = clampScale(Math.min(availW / w, availH / h))
  const cx = (bounds.minX + bounds.maxX) / 2
  const cy = (bounds.minY + bounds.maxY) / 2
  return { scale, tx: viewportPx.width / 2 - scale * cx, ty: viewportPx.height / 2 + scale * cy }
}

/** A box on the screen, in CSS pixels from the viewport's top-left corner. */
export interface ScreenBox {
  x: number
  y: number
  width: number
  height: number
}

/** `fitToBounds` inside a part of the viewport (`box`), the view still in the viewport's own pixels. */
export function fitInBox(bounds: Bounds, box: ScreenBox, margin = 24): View {
  const v = fitToBounds(bounds, { width: box.width, height: box.height }, margin)
  return { scale: v.scale, tx: v.tx + box.x, ty: v.ty + box.y }
}

/** Where `bounds` lands on the screen under `view`. */
export function screenBoxOf(view: View, bounds: Bounds): ScreenBox {
  const a = worldToScreen(view, worldPoint(bounds.minX, bounds.maxY))
  const b = worldToScreen(view, worldPoint(bounds.maxX, bounds.minY))
  return { x: a.x, y: a.y, width: b.x - a.x, height: b.y - a.y }
}

/**
 * Fit that keeps the chip clear of a panel floating over the viewport's top-left corner (`corner`: its right and
 * bottom edges, CSS px): the plain fit when the chip misses the panel, else the larger of the fits below it and
 * beside it, so no part of the chip is hidden under the panel.
 */
export function fitClearOf(
  bounds: Bounds,
  viewportPx: ViewportSize,
  margin = 24,
  corner?: { width: number; height: number } | null,
): View {
  const plain = fitToBounds(bounds, viewportPx, margin)
  if (!corner || corner.width <= 0 || corner.height <= 0) return plain
  const on = screenBoxOf(plain, bounds)
  if (on.x >= corner.width || on.y >= corner.height) return plain
  const below = fitInBox(
    bounds,
    { x: 0, y: corner.height, width: viewportPx.width, height: Math.max(viewportPx.height - corner.height, 1) },
    margin,
  )
  const beside = fitInBox(
    bounds,
    { x: corner.width, y: 0, width: Math.max(viewportPx.width - corner.width, 1), height: viewportPx.height },
    margin,
  )
  return below.scale >= beside.scale ? below : beside
}

/** Zooms by `factor` keeping the world point under `screenPoint` fixed on the screen (clamped to the limits). */
export function zoomAround(view: View, factor: number, at: ScreenPoint): View {
  const scale = clampScale(view.scale * factor)
  const anchor = screenToWorld(view, at)
  return { scale, tx: at.x - scale * anchor.x, ty: at.y + scale * anchor.y }
}

/** Moves the view by a screen-pixel delta (a drag). */
export function panBy(view: View, dxPx: number, dyPx: number): View {
  return { scale: view.scale, tx: view.tx + dxPx, ty: view.ty + dyPx }
}

/** Centres the view on a world point at the current scale. */
export function centreOn(view: View, p: WorldPoint, viewportPx: ViewportSize): View {
  return {
    scale: view.scale,
    tx: viewportPx.width / 2 - view.scale * p.x,
    ty: viewportPx.height / 2 + view.scale * p.y,
  }
}

/** The world box visible in the viewport. */
export function visibleBounds(view: View, viewportPx: ViewportSize): Bounds {
  const a = screenToWorld(view, screenPoint(0, viewportPx.height))
  const b = screenToWorld(view, screenPoint(viewportPx.width, 0))
  return { minX: a.x, minY: a.y, maxX: b.x, maxY: b.y }
}

/** Grows bounds to include a point. */
export function extend(b: Bounds, x: number, y: number): void {
  if (x < b.minX) b.minX = x
  if (x > b.maxX) b.maxX = x
  if (y < b.minY) b.minY = y
  if (y > b.maxY) b.maxY = y
}

export const emptyBounds = (): Bounds => ({ minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity })
export const isEmpty = (b: Bounds): boolean => !(b.maxX >= b.minX && b.maxY >= b.minY)
