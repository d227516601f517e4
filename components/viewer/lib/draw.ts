// Canvas drawing for the chip viewer. The world is drawn with one non-zero fill per layer from a Path2D built
// once per ring list (µm, transformed by the view), so a 512-nozzle chip is a handful of fill calls; markers are
// drawn in screen pixels on a separate layer so hovering never redraws the chip.
import type { Pair } from '~~/geometry/types'
import type { CompareOverlay } from './compare'
import { CALLOUT, FINDING, PIN, type PlacedCallout, type PlacedFinding, type PlacedPin } from './markers'
import { canvasColors as C, MONO_FONT, SANS_FONT } from './palette'
import type { ChipScene } from './scene'
import type { View } from './viewport'

const paths = new WeakMap<object, Path2D>()

/** One Path2D for a list of flat rings, built once per list. */
export function ringsPath(rings: Float64Array[]): Path2D {
  let p = paths.get(rings)
  if (!p) {
    p = new Path2D()
    for (const r of rings) {
      if (r.length < 6) continue
      p.moveTo(r[0]!, r[1]!)
      for (let i = 2; i < r.length; i += 2) p.lineTo(r[i]!, r[i + 1]!)
      p.closePath()
    }
    paths.set(rings, p)
  }
  return p
}

function ringPath(ring: Pair[]): Path2D {
  let p = paths.get(ring)
  if (!p) {
    p = new Path2D()
    ring.forEach(([x, y], i) => (i === 0 ? p!.moveTo(x, y) : p!.lineTo(x, y)))
    p.closePath()
    paths.set(ring, p)
  }
  return p
}

let hatch: CanvasPattern | null = null
function hatchPattern(ctx: CanvasRenderingContext2D): CanvasPattern | null {
  if (hatch) return hatch
  const tile = document.createElement('canvas')
  tile.width = tile.height = 8
  const t = tile.getContext('2d')
  if (!t) return null
  t.fillStyle = C.changedFill
  t.fillRect(0, 0, 8, 8)
  t.strokeStyle = C.changed
  t.lineWidth = 2
  t.beginPath()
  t.moveTo(-2, 10); t.lineTo(10, -2); t.moveTo(-2, 2); t.lineTo(2, -2); t.moveTo(6, 10); t.lineTo(10, 6)
  t.stroke()
  hatch = ctx.createPattern(tile, 'repeat')
  return hatch
}

export interface WorldState {
  view: View
  hiddenLayers: ReadonlySet<string>
  showMarks: boolean
  compare: CompareOverlay | null
  outlineBefore: Pair[] | null
}

/** The chip: edge, layers by depth (or muted under a compare overlay), marks, text, ports, compare overlay. */
export function drawWorld(ctx: CanvasRenderingContext2D, scene: ChipScene, st: WorldState): void {
  const { scale, tx, ty } = st.view
  const px = 1 / scale // one CSS pixel in µm
  ctx.save()
  ctx.transform(scale, 0, 0, -scale, tx, ty)
  ctx.lineJoin = 'round'
  if (scene.chipOutline) {
    const edge = ringPath(scene.chipOutline)
    ctx.fillStyle = C.chip
    ctx.fill(edge)
    ctx.strokeStyle = C.chipEdge
    ctx.lineWidth = 1.25 * px
    ctx.stroke(edge)
  }
  for (const l of scene.layers) {
    if (st.hiddenLayers.has(l.layerId)) continue
    ctx.fillStyle = st.compare ? C.muted : l.style.fill
    ctx.fill(ringsPath(l.rings), 'nonzero')
  }
  if (!st.compare) drawPorts(ctx, scene, st, px)
  if (st.showMarks) {
    ctx.fillStyle = C.marks
    ctx.fill(ringsPath(scene.marks), 'nonzero')
    drawTexts(ctx, scene)
  }
  if (st.compare) drawCompare(ctx, st.compare, st.outlineBefore, px)
  ctx.restore()
}

function drawPorts(ctx: CanvasRenderingContext2D, scene: ChipScene, st: WorldState, px: number): void {
  ctx.lineWidth = 2 * px
  for (const p of scene.ports) {
    ctx.strokeStyle = p.kind === 'outlet' ? C.outlet : p.phase === 'dispersed' ? C.inletDispersed : C.inletContinuous
    ctx.setLineDash(p.kind === 'outlet' ? [4 * px, 3 * px] : [])
    ctx.beginPath()
    ctx.arc(p.x, p.y, p.radius + 3 * px, 0, Math.PI * 2)
    ctx.stroke()
  }
  ctx.setLineDash([])
}

function drawTexts(ctx: CanvasRenderingContext2D, scene: ChipScene): void {
  ctx.fillStyle = C.text
  ctx.textBaseline = 'alphabetic'
  for (const t of scene.texts) {
    ctx.save()
    ctx.translate(t.x, t.y)
    ctx.scale(1, -1) // text reads upright in the y-up world
    ctx.font = `500 ${t.height / 0.7}px ${SANS_FONT}` // cap height ≈ 0.7 em ≈ the mark's height
    ctx.fillText(t.text, 0, 0)
    ctx.restore()
  }
}

function drawCompare(ctx: CanvasRenderingContext2D, o: CompareOverlay, outlineBefore: Pair[] | null, px: number): void {
  // changed: hatched in the caution colour, with where it was as a thin dotted line
  const pattern = hatchPattern(ctx)
  if (pattern) {
    pattern.setTransform(new DOMMatrix([px, 0, 0, -px, 0, 0]))
    ctx.fillStyle = pattern
  } else ctx.fillStyle = C.changedFill
  ctx.fill(ringsPath(o.changed), 'nonzero')
  ctx.strokeStyle = C.changed
  ctx.lineWidth = 1.5 * px
  ctx.stroke(ringsPath(o.changed))
  ctx.setLineDash([2 * px, 3 * px])
  ctx.lineWidth = 1 * px
  ctx.stroke(ringsPath(o.changedBefore))
  // added: solid accent fill
  ctx.setLineDash([])
  ctx.fillStyle = C.added
  ctx.fill(ringsPath(o.added), 'nonzero')
  // removed: a dashed outline only (it is not on this revision)
  ctx.strokeStyle = C.removed
  ctx.lineWidth = 1.75 * px
  ctx.setLineDash([6 * px, 4 * px])
  ctx.stroke(ringsPath(o.removed))
  if (outlineBefore) ctx.stroke(ringPath(outlineBefore))
  ctx.setLineDash([])
}

/** Outlines one element's pieces (hover or selection), in screen-constant line width. */
export function drawHighlight(ctx: CanvasRenderingContext2D, rings: Float64Array[], view: View, color: string, widthPx: number): void {
  ctx.save()
  ctx.transform(view.scale, 0, 0, -view.scale, view.tx, view.ty)
  ctx.strokeStyle = color
  ctx.lineWidth = widthPx / view.scale
  ctx.lineJoin = 'round'
  ctx.stroke(ringsPath(rings))
  ctx.restore()
}

export function drawCallouts(ctx: CanvasRenderingContext2D, callouts: PlacedCallout[]): void {
  ctx.font = `${CALLOUT.fontPx}px ${MONO_FONT}`
  ctx.textBaseline = 'middle'
  for (const c of callouts) {
    const { x, y, w, h } = c.box
    const near = { x: c.ax < x ? x : x + w, y: c.ay < y ? y : y + h }
    ctx.strokeStyle = C.tone[c.tone]
    ctx.lineWidth = 1
    ctx.beginPath(); ctx.moveTo(c.ax, c.ay); ctx.lineTo(near.x, near.y); ctx.stroke()
    ctx.beginPath(); ctx.arc(c.ax, c.ay, 2.5, 0, Math.PI * 2); ctx.fillStyle = C.tone[c.tone]; ctx.fill()
    ctx.fillStyle = 'rgba(255,255,255,0.94)'
    ctx.fillRect(x, y, w, h)
    ctx.strokeRect(x + 0.5, y + 0.5, w - 1, h - 1)
    ctx.fillStyle = C.tone[c.tone]
    ctx.fillRect(x, y, 3, h)
    ctx.fillStyle = C.hover
    c.lines.forEach((line, i) => ctx.fillText(line, x + CALLOUT.padX, y + CALLOUT.padY + (i + 0.5) * CALLOUT.linePx))
  }
}

export function drawFindings(ctx: CanvasRenderingContext2D, findings: PlacedFinding[]): void {
  const s = FINDING.size
  ctx.textAlign = 'center'
  ctx.textBaseline = 'middle'
  ctx.font = `700 10px ${SANS_FONT}`
  for (const { finding, x, y } of findings) {
    ctx.fillStyle = C.severity[finding.severity]
    ctx.strokeStyle = '#ffffff'
    ctx.lineWidth = 1.5
    ctx.beginPath()
    if (finding.severity === 'error') { ctx.moveTo(x, y - s); ctx.lineTo(x + s, y); ctx.lineTo(x, y + s); ctx.lineTo(x - s, y) }
    else if (finding.severity === 'warning') { ctx.moveTo(x, y - s); ctx.lineTo(x + s, y + s * 0.8); ctx.lineTo(x - s, y + s * 0.8) }
    else ctx.arc(x, y, s * 0.85, 0, Math.PI * 2)
    ctx.closePath(); ctx.fill(); ctx.stroke()
    ctx.fillStyle = '#ffffff'
    ctx.fillText(finding.severity === 'info' ? 'i' : '!', x, y + (finding.severity === 'warning' ? 2 : 0.5))
  }
  ctx.textAlign = 'start'
}

export function drawPins(ctx: CanvasRenderingContext2D, pins: PlacedPin[]): void {
  const r = PIN.radius
  ctx.textAlign = 'center'
  ctx.textBaseline = 'middle'
  ctx.font = `500 11px ${MONO_FONT}`
  for (const { pin, x, y, cx, cy } of pins) {
    const fill = pin.resolved ? C.pinResolved : C.pin
    if (pin.active) {
      ctx.beginPath(); ctx.arc(cx, cy, r + 4, 0, Math.PI * 2); ctx.fillStyle = C.pinActive; ctx.fill()
    }
    ctx.beginPath()
    ctx.moveTo(x, y)
    ctx.lineTo(cx - r * 0.55, cy + r * 0.8)
    ctx.arc(cx, cy, r, Math.PI * 0.7, Math.PI * 0.3)
    ctx.closePath()
    ctx.fillStyle = fill
    ctx.strokeStyle = '#ffffff'
    ctx.lineWidth = 1.5
    ctx.fill(); ctx.stroke()
    ctx.fillStyle = pin.resolved ? C.hover : '#ffffff'
    ctx.fillText(String(pin.index), cx, cy + 0.5)
  }
  ctx.textAlign = 'start'
}
