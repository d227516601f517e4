// Canvas drawing for the chip viewer. The world is drawn with non-zero fills of Path2Ds built once per ring list
// (µm, transformed by the view): each layer in chunks of neighbouring elements (scene.ts), so what lies outside
// the view is skipped (culling) and a chunk whose pieces are only a few pixels is drawn simplified, as the boxes
// of its pieces (level of detail); markers are drawn in screen pixels on a separate layer so hovering never
// redraws the chip.
import type { Pair } from '~~/geometry/types'
import type { CompareOverlay } from './compare'
import { CALLOUT, FINDING, PIN, type PlacedCallout, type PlacedFinding, type PlacedPin } from './markers'
import { canvasColors as C, MONO_FONT, SANS_FONT } from './palette'
import type { ChipScene, SceneChunk } from './scene'
import { visibleBounds, type Bounds, type View, type ViewportSize } from './viewport'

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
  t.moveTo(-2, 10)
  t.lineTo(10, -2)
  t.moveTo(-2, 2)
  t.lineTo(2, -2)
  t.moveTo(6, 10)
  t.lineTo(10, 6)
  t.stroke()
  hatch = ctx.createPattern(tile, 'repeat')
  return hatch
}

export interface WorldState {
  view: View
  /** The canvas size in CSS pixels: with it, chunks outside the view are not drawn. */
  size?: ViewportSize
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
  const seen = st.size ? visibleBounds(st.view, st.size) : null
  for (const l of scene.layers) {
    if (st.hiddenLayers.has(l.layerId)) continue
    ctx.fillStyle = st.compare ? C.muted : l.style.fill
    fillChunks(ctx, l.chunks, seen, scale)
  }
  if (!st.compare) drawPorts(ctx, scene, st, px)
  if (st.showMarks) {
    ctx.fillStyle = C.marks
    fillChunks(ctx, scene.markChunks, seen, scale)
    drawTexts(ctx, scene)
  }
  if (st.compare) drawCompare(ctx, st.compare, st.outlineBefore, px)
  ctx.restore()
}

/**
 * Level of detail (common practice, no source): when every piece of a chunk is under DETAIL_PX CSS pixels its
 * outline cannot be told from its box, so the boxes are filled (a punch's 70-point circle becomes 4 points); when
 * the whole chunk is under BLOCK_PX it is one rectangle.
 */
export const DETAIL_PX = 3
export const BLOCK_PX = 2

/** What drawWorld does with a chunk at this view: skip it (outside the view), one box, its pieces' boxes, its rings. */
export function chunkDetail(
  chunk: SceneChunk,
  seen: Bounds | null,
  scale: number,
): 'outside' | 'block' | 'boxes' | 'full' {
  const b = chunk.box
  if (!(b.maxX >= b.minX)) return 'outside'
  if (seen && (b.maxX < seen.minX || b.minX > seen.maxX || b.maxY < seen.minY || b.minY > seen.maxY)) return 'outside'
  if (Math.max(b.maxX - b.minX, b.maxY - b.minY) * scale < BLOCK_PX) return 'block'
  return chunk.maxSide * scale < DETAIL_PX ? 'boxes' : 'full'
}

function fillChunks(ctx: CanvasRenderingContext2D, chunks: SceneChunk[], seen: Bounds | null, scale: number): void {
  for (const c of chunks) {
    const d = chunkDetail(c, seen, scale)
    if (d === 'outside') continue
    if (d === 'block') ctx.fillRect(c.box.minX, c.box.minY, c.box.maxX - c.box.minX, c.box.maxY - c.box.minY)
    else ctx.fill(d === 'full' ? ringsPath(c.rings) : boxesPath(c.rings), 'nonzero')
  }
}

const boxPaths = new WeakMap<object, Path2D>()

/** The boxes of a list of rings, one rectangle each (wound counter-clockwise, as exteriors), built once per list. */
export function boxesPath(rings: Float64Array[]): Path2D {
  let p = boxPaths.get(rings)
  if (!p) {
    p = new Path2D()
    for (const r of rings) {
      let minX = Infinity,
        minY = Infinity,
        maxX = -Infinity,
        maxY = -Infinity
      for (let i = 0; i < r.length; i += 2) {
        const x = r[i]!,
          y = r[i + 1]!
        if (x < minX) minX = x
        if (x > maxX) maxX = x
        if (y < minY) minY = y
        if (y > maxY) maxY = y
      }
      if (!(maxX >= minX)) continue
      // Holes are dropped: a hole's box would cancel its exterior's fill. Clockwise rings are holes (scene.ts).
      let a = 0
      for (let i = 0, j = r.length - 2; i < r.length; j = i, i += 2) a += r[j]! * r[i + 1]! - r[i]! * r[j + 1]!
      if (a < 0) continue
      p.moveTo(minX, minY)
      p.lineTo(maxX, minY)
      p.lineTo(maxX, maxY)
      p.lineTo(minX, maxY)
      p.closePath()
    }
    boxPaths.set(rings, p)
  }
  return p
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
export function drawHighlight(
  ctx: CanvasRenderingContext2D,
  rings: Float64Array[],
  view: View,
  color: string,
  widthPx: number,
): void {
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
    ctx.beginPath()
    ctx.moveTo(c.ax, c.ay)
    ctx.lineTo(near.x, near.y)
    ctx.stroke()
    ctx.beginPath()
    ctx.arc(c.ax, c.ay, 2.5, 0, Math.PI * 2)
    ctx.fillStyle = C.tone[c.tone]
    ctx.fill()
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
    if (finding.severity === 'error') {
      ctx.moveTo(x, y - s)
      ctx.lineTo(x + s, y)
      ctx.lineTo(x, y + s)
      ctx.lineTo(x - s, y)
    } else if (finding.severity === 'warning') {
      ctx.moveTo(x, y - s)
      ctx.lineTo(x + s, y + s * 0.8)
      ctx.lineTo(x - s, y + s * 0.8)
    } else ctx.arc(x, y, s * 0.85, 0, Math.PI * 2)
    ctx.closePath()
    ctx.fill()
    ctx.stroke()
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
      ctx.beginPath()
      ctx.arc(cx, cy, r + 4, 0, Math.PI * 2)
      ctx.fillStyle = C.pinActive
      ctx.fill()
    }
    ctx.beginPath()
    ctx.moveTo(x, y)
    ctx.lineTo(cx - r * 0.55, cy + r * 0.8)
    ctx.arc(cx, cy, r, Math.PI * 0.7, Math.PI * 0.3)
    ctx.closePath()
    ctx.fillStyle = fill
    ctx.strokeStyle = '#ffffff'
    ctx.lineWidth = 1.5
    ctx.fill()
    ctx.stroke()
    ctx.fillStyle = pin.resolved ? C.hover : '#ffffff'
    ctx.fillText(String(pin.index), cx, cy + 0.5)
  }
  ctx.textAlign = 'start'
}
