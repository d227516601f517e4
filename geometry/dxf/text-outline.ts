// Text as closed outlines for the mask DXF: a plotter or mask writer ignores fonts, so each glyph's contours are
// flattened to line segments here. Pure: the caller parses the font (server/utils/labelFont.ts) and passes the
// shaped glyphs in through `OutlineFont`; nothing here reads files.
import type { Pair } from '../types'
import { signedArea } from '../vec'

/** One drawing command of a glyph outline, in font units with y up (the shape fontkit and opentype.js give). */
export interface GlyphCommand {
  command: 'moveTo' | 'lineTo' | 'quadraticCurveTo' | 'bezierCurveTo' | 'closePath'
  args: readonly number[]
}

/** A glyph placed by the font's layout: its outline and advance, in font units. */
export interface ShapedGlyph {
  id: number
  commands: readonly GlyphCommand[]
  xAdvance: number
  xOffset: number
  yOffset: number
}

/** What the DXF writer needs of a font: its metrics and a layout of a line of text. */
export interface OutlineFont {
  unitsPerEm: number
  /** Height of the capital letters, font units: a DXF text height is the cap height, so this sets the scale. */
  capHeight: number
  hasCharacter(codePoint: number): boolean
  layout(text: string): ShapedGlyph[]
}

/** Largest distance between a curve and the segments drawn for it, µm (as for punch circles in outlines/). */
export const TEXT_CHORD_TOLERANCE_UM = 0.1
const MAX_CURVE_SEGMENTS = 64

/**
 * Segments for a Bézier curve of degree d so the chord error stays ≤ tol with uniform subdivision in t:
 * Wang's formula, n = ⌈√( d(d−1)/(8·tol) · maxᵢ ‖Pᵢ − 2Pᵢ₊₁ + Pᵢ₊₂‖ )⌉ (Wang Guozhao 1984, as given in
 * R. Goldman, "Pyramid Algorithms", Morgan Kaufmann 2003 — the exact section from memory). It is the bound
 * ‖f − Lₕf‖ ≤ h²/8 · max‖f″‖ of linear interpolation (de Boor, "A Practical Guide to Splines", 1978, ch. II)
 * with ‖B″‖ ≤ d(d−1) · max second difference of the control points and h = 1/n.
 */
export function bezierSegments(points: readonly Pair[], tol: number): number {
  const d = points.length - 1
  let m = 0
  for (let i = 0; i + 2 <= d; i++) {
    const a = points[i]!,
      b = points[i + 1]!,
      c = points[i + 2]!
    m = Math.max(m, Math.hypot(a[0] - 2 * b[0] + c[0], a[1] - 2 * b[1] + c[1]))
  }
  const n = Math.ceil(Math.sqrt((d * (d - 1) * m) / (8 * tol)))
  return Math.min(MAX_CURVE_SEGMENTS, Math.max(1, n))
}

/** A point of a Bézier curve by de Casteljau's algorithm (de Casteljau 1959; Farin, "Curves and Surfaces for CAGD", ch. 3). */
function deCasteljau(points: readonly Pair[], t: number): Pair {
  const p = points.map((q): Pair => [q[0], q[1]])
  for (let k = p.length - 1; k > 0; k--) {
    for (let i = 0; i < k; i++)
      p[i] = [p[i]![0] + t * (p[i + 1]![0] - p[i]![0]), p[i]![1] + t * (p[i + 1]![1] - p[i]![1])]
  }
  return p[0]!
}

/** A glyph's contours as closed rings (no repeated closing point), font units, curves within `tol` font units. */
export function flattenGlyph(commands: readonly GlyphCommand[], tol: number): Pair[][] {
  const rings: Pair[][] = []
  let ring: Pair[] = []
  const close = () => {
    const f = ring[0],
      l = ring[ring.length - 1]
    if (ring.length > 1 && f && l && f[0] === l[0] && f[1] === l[1]) ring.pop()
    if (ring.length >= 3) rings.push(ring)
    ring = []
  }
  for (const c of commands) {
    const a = c.args
    const last = ring[ring.length - 1]
    if (c.command === 'moveTo') {
      close()
      ring.push([a[0]!, a[1]!])
    } else if (c.command === 'lineTo') {
      ring.push([a[0]!, a[1]!])
    } else if (c.command === 'closePath') {
      close()
    } else if (last) {
      const ctrl: Pair[] = [last]
      for (let i = 0; i + 1 < a.length; i += 2) ctrl.push([a[i]!, a[i + 1]!])
      const n = bezierSegments(ctrl, tol)
      for (let k = 1; k <= n; k++) ring.push(k === n ? ctrl[ctrl.length - 1]! : deCasteljau(ctrl, k / n))
    }
  }
  close()
  return rings
}

const inside = (p: Pair, ring: readonly Pair[]) => {
  let c = false
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const a = ring[i]!,
      b = ring[j]!
    if (a[1] > p[1] !== b[1] > p[1] && p[0] < ((b[0] - a[0]) * (p[1] - a[1])) / (b[1] - a[1]) + a[0]) c = !c
  }
  return c
}

/**
 * Orient rings as the mask layers are: a ring inside an even number of the glyph's other rings is an outer
 * boundary (counter-clockwise, y up), inside an odd number a hole (clockwise). Fonts disagree on direction
 * (TrueType outers clockwise, CFF counter-clockwise), so nesting decides, not the font.
 */
export function orientRings(rings: Pair[][]): Pair[][] {
  return rings.map((r, i) => {
    const depth = rings.reduce((n, other, j) => (j !== i && inside(r[0]!, other) ? n + 1 : n), 0)
    const ccw = signedArea(r) > 0
    return ccw === (depth % 2 === 0) ? r : [...r].reverse()
  })
}

/** Characters the font can draw; the rest are left out (as the DXF TEXT entity keeps ASCII only). */
export function drawableText(font: OutlineFont, s: string): string {
  return [...s.normalize('NFC')]
    .filter(ch => (ch.trim() === '' ? ch === ' ' : font.hasCharacter(ch.codePointAt(0)!)))
    .join('')
    .trim()
}

const glyphCache = new WeakMap<OutlineFont, Map<string, Pair[][]>>()

/**
 * A line of text as closed, oriented rings in µm: baseline-left at (x, y), capital letters `heightUm` tall (the
 * DXF TEXT entity's height), curves within `toleranceUm` of the glyph outline.
 */
export function textOutlines(
  font: OutlineFont,
  text: string,
  x: number,
  y: number,
  heightUm: number,
  toleranceUm = TEXT_CHORD_TOLERANCE_UM,
): Pair[][] {
  const s = drawableText(font, text)
  if (!s || !(heightUm > 0)) return []
  const scale = heightUm / font.capHeight
  const tolFu = toleranceUm / scale
  const cache = glyphCache.get(font) ?? new Map<string, Pair[][]>()
  glyphCache.set(font, cache)
  const out: Pair[][] = []
  let pen = 0
  for (const g of font.layout(s)) {
    const key = `${g.id}@${tolFu.toPrecision(6)}`
    let rings = cache.get(key)
    if (!rings) {
      rings = orientRings(flattenGlyph(g.commands, tolFu))
      cache.set(key, rings)
    }
    const ox = pen + g.xOffset,
      oy = g.yOffset
    for (const r of rings) out.push(r.map((p): Pair => [x + (p[0] + ox) * scale, y + (p[1] + oy) * scale]))
    pen += g.xAdvance
  }
  return out
}
