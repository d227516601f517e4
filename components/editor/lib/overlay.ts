// What the editor draws over the chip, in screen pixels: grid, selection outlines, the ghost of a drag, the
// channel being drawn, a measurement and the selection box.
import { formatLengthUm } from '#shared/format/quantity'
import { drawHighlight } from '../../viewer/lib/draw'
import { canvasColors, colors, MONO_FONT } from '../../viewer/lib/palette'
import {
  worldPoint,
  worldToScreen,
  screenToWorld,
  screenPoint,
  type View,
  type ViewportSize,
} from '../../viewer/lib/viewport'
import type { PointUm } from '~~/shared/editor'

/** Grid lines every `pitch` µm (or a multiple of it, so lines stay ≥ 8 px apart). */
export function drawGrid(ctx: CanvasRenderingContext2D, view: View, size: ViewportSize, pitch: number) {
  if (!(pitch > 0)) return
  let step = pitch
  while (step * view.scale < 8) step *= 5
  const a = screenToWorld(view, screenPoint(0, size.height))
  const b = screenToWorld(view, screenPoint(size.width, 0))
  ctx.save()
  ctx.strokeStyle = 'rgba(62, 74, 86, 0.12)'
  ctx.lineWidth = 1
  ctx.beginPath()
  for (let x = Math.ceil(a.x / step) * step; x <= b.x; x += step) {
    const s = view.tx + x * view.scale
    ctx.moveTo(Math.round(s) + 0.5, 0)
    ctx.lineTo(Math.round(s) + 0.5, size.height)
  }
  for (let y = Math.ceil(a.y / step) * step; y <= b.y; y += step) {
    const s = view.ty - y * view.scale
    ctx.moveTo(0, Math.round(s) + 0.5)
    ctx.lineTo(size.width, Math.round(s) + 0.5)
  }
  ctx.stroke()
  ctx.restore()
}

/** Outlines of the selected elements, moved by (dx, dy) µm while a drag is under way. */
export function drawSelection(
  ctx: CanvasRenderingContext2D,
  rings: Float64Array[][],
  view: View,
  drag: PointUm | null,
) {
  const v = drag ? { scale: view.scale, tx: view.tx + drag.x * view.scale, ty: view.ty - drag.y * view.scale } : view
  for (const r of rings) {
    if (drag) {
      ctx.save()
      ctx.globalAlpha = 0.35
      ctx.fillStyle = colors.aqueous[400]
      ctx.transform(v.scale, 0, 0, -v.scale, v.tx, v.ty)
      ctx.fill(pathOf(r))
      ctx.restore()
    }
    drawHighlight(ctx, r, v, canvasColors.selected, 2)
  }
}

function pathOf(rings: Float64Array[]): Path2D {
  const p = new Path2D()
  for (const r of rings) {
    p.moveTo(r[0]!, r[1]!)
    for (let i = 2; i < r.length; i += 2) p.lineTo(r[i]!, r[i + 1]!)
    p.closePath()
  }
  return p
}

/** The channel being drawn: its centre line at true width, and the rubber band to the pointer. */
export function drawDraft(
  ctx: CanvasRenderingContext2D,
  view: View,
  points: PointUm[],
  to: PointUm | null,
  widthUm: number,
  snapped: PointUm | null,
) {
  const all = to ? [...points, to] : points
  if (all.length >= 1) {
    ctx.save()
    ctx.strokeStyle = 'rgba(31, 111, 139, 0.45)'
    ctx.lineWidth = Math.max(1, widthUm * view.scale)
    ctx.lineJoin = 'round'
    ctx.lineCap = 'butt'
    ctx.beginPath()
    all.forEach((p, i) => {
      const s = worldToScreen(view, worldPoint(p.x, p.y))
      if (i === 0) ctx.moveTo(s.x, s.y)
      else ctx.lineTo(s.x, s.y)
    })
    ctx.stroke()
    ctx.setLineDash([4, 3])
    ctx.lineWidth = 1
    ctx.strokeStyle = colors.aqueous[700]
    ctx.stroke()
    ctx.restore()
  }
  if (snapped) ring(ctx, view, snapped, colors.oil[500])
}

function ring(ctx: CanvasRenderingContext2D, view: View, p: PointUm, color: string) {
  const s = worldToScreen(view, worldPoint(p.x, p.y))
  ctx.save()
  ctx.strokeStyle = color
  ctx.lineWidth = 2
  ctx.beginPath()
  ctx.arc(s.x, s.y, 7, 0, Math.PI * 2)
  ctx.stroke()
  ctx.restore()
}

/** A measurement from a to b with its length and components in µm. */
export function drawMeasure(ctx: CanvasRenderingContext2D, view: View, a: PointUm, b: PointUm) {
  const sa = worldToScreen(view, worldPoint(a.x, a.y))
  const sb = worldToScreen(view, worldPoint(b.x, b.y))
  ctx.save()
  ctx.strokeStyle = colors.graphite[900]
  ctx.lineWidth = 1.5
  ctx.setLineDash([6, 3])
  ctx.beginPath()
  ctx.moveTo(sa.x, sa.y)
  ctx.lineTo(sb.x, sb.y)
  ctx.stroke()
  ctx.setLineDash([])
  const text = measureText(a, b)
  ctx.font = `11px ${MONO_FONT}`
  const w = ctx.measureText(text).width + 10
  const mx = (sa.x + sb.x) / 2 + 8
  const my = (sa.y + sb.y) / 2 - 22
  ctx.fillStyle = colors.graphite[900]
  ctx.fillRect(mx, my, w, 18)
  ctx.fillStyle = '#fff'
  ctx.textBaseline = 'middle'
  ctx.fillText(text, mx + 5, my + 9)
  ctx.restore()
}

export const measureText = (a: PointUm, b: PointUm): string => {
  const dx = b.x - a.x
  const dy = b.y - a.y
  const f = (v: number) => formatLengthUm(v, 4)
  return `${f(Math.hypot(dx, dy))}  (Δx ${f(dx)}, Δy ${f(dy)})`
}

/** The rubber-band box of a box selection, in screen pixels. */
export function drawBox(ctx: CanvasRenderingContext2D, a: { x: number; y: number }, b: { x: number; y: number }) {
  ctx.save()
  ctx.fillStyle = 'rgba(63, 144, 176, 0.08)'
  ctx.strokeStyle = colors.aqueous[500]
  ctx.lineWidth = 1
  ctx.setLineDash([4, 2])
  const x = Math.min(a.x, b.x),
    y = Math.min(a.y, b.y),
    w = Math.abs(a.x - b.x),
    h = Math.abs(a.y - b.y)
  ctx.fillRect(x, y, w, h)
  ctx.strokeRect(x + 0.5, y + 0.5, w, h)
  ctx.restore()
}

/**
 * Handles on the points of a selected channel (squares for bends, circles for ends); while one is dragged, the
 * channel's centre line with that point moved, at true width.
 */
export function drawChannelHandles(
  ctx: CanvasRenderingContext2D,
  view: View,
  points: PointUm[],
  widthUm: number,
  moving: { index: number; point: PointUm } | null,
) {
  const pts = moving ? points.map((p, i) => (i === moving.index ? moving.point : p)) : points
  if (moving) drawDraft(ctx, view, pts, null, widthUm, null)
  ctx.save()
  ctx.lineWidth = 1.5
  pts.forEach((p, i) => {
    const s = worldToScreen(view, worldPoint(p.x, p.y))
    ctx.fillStyle = moving?.index === i ? colors.oil[300] : '#fff'
    ctx.strokeStyle = colors.aqueous[700]
    ctx.beginPath()
    if (i === 0 || i === pts.length - 1) ctx.arc(s.x, s.y, 5, 0, Math.PI * 2)
    else ctx.rect(s.x - 4.5, s.y - 4.5, 9, 9)
    ctx.fill()
    ctx.stroke()
  })
  ctx.restore()
}
