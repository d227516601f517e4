import Drawing from 'dxf-writer'
import type { ChipDocument } from '#shared/schemas/chip'
import type { ChipOutlines } from '../outlines'
import { buildOutlines, mergePieces } from '../outlines'
import type { MultiPolygon, Pair } from '../types'
import { asciiText, depthLayerName, MARKS_LAYER_NAME, OUTLINE_LAYER, TEXT_LAYER } from './layer-names'
import { textOutlines, type OutlineFont } from './text-outline'

export interface DxfOptions {
  /** Mirror left–right about the chip's centre (for the mould). */
  mirror?: boolean
  /** Only these layers: document layer ids or DXF names (`CH-50um`, `OUTLINE`, `MARKS`, `TEXT`). */
  layers?: string[]
  revision?: string
  /** ISO date for the title block; defaults to today. */
  date?: string
  /** Reuse outlines already built. */
  outlines?: ChipOutlines
  /**
   * Text on the text layer: `outline` (the default) draws each glyph as closed polylines from `font`, which a
   * plotter or mask writer prints; `font` writes DXF TEXT entities (ASCII), which only CAD programs show.
   * Without a `font` to outline with, text is written as TEXT entities.
   */
  text?: 'outline' | 'font'
  font?: OutlineFont
}

export interface DxfLayerSummary {
  name: string
  depth?: number
  polygons: MultiPolygon
}

/** The mask layers that will be written: channel layers grouped by depth and merged, plus marks. */
export function dxfLayers(o: ChipOutlines): DxfLayerSummary[] {
  const byDepth = new Map<number, MultiPolygon[]>()
  for (const l of o.layers) byDepth.set(l.depth, [...(byDepth.get(l.depth) ?? []), l.polygons])
  const out: DxfLayerSummary[] = [...byDepth]
    .sort((a, b) => a[0] - b[0])
    .map(([depth, parts]) => ({
      name: depthLayerName(depth),
      depth,
      polygons: parts.length === 1 ? parts[0]! : mergePieces(parts.flat()).merged,
    }))
  out.push({ name: MARKS_LAYER_NAME, polygons: o.marks })
  return out
}

const dropClosing = (ring: Pair[]): Pair[] => {
  const f = ring[0]
  const l = ring[ring.length - 1]
  return ring.length > 1 && f && l && f[0] === l[0] && f[1] === l[1] ? ring.slice(0, -1) : ring
}

/**
 * The chip as a DXF mask: $INSUNITS 13 (micrometres), one layer per channel depth named with the depth, each
 * merged outline and each hole a closed LWPOLYLINE, the chip outline and marks on their own layers, text and a
 * title block (design, revision, date) on a text layer. Never throws on a valid document.
 */
export function exportDxf(doc: ChipDocument, options: DxfOptions = {}): string {
  const o = options.outlines ?? buildOutlines(doc)
  const wanted = options.layers && options.layers.length > 0 ? new Set(options.layers) : null
  const idsByName = new Map<string, string[]>()
  for (const l of doc.layers)
    idsByName.set(depthLayerName(l.depth), [...(idsByName.get(depthLayerName(l.depth)) ?? []), l.id])
  const include = (name: string) =>
    !wanted || wanted.has(name) || (idsByName.get(name) ?? []).some(id => wanted.has(id))

  const ring = o.chipOutline
  const xs = ring ? ring.map(p => p[0]) : o.layers.flatMap(l => l.polygons.flatMap(p => p[0]?.map(q => q[0]) ?? []))
  const cx = xs.length > 0 ? (Math.min(...xs) + Math.max(...xs)) / 2 : 0
  const tx = (p: Pair): [number, number] => (options.mirror ? [2 * cx - p[0], p[1]] : [p[0], p[1]])

  const d = new Drawing()
  d.setUnits('Microns')
  const colours = [1, 5, 3, 6, 4, 2, 30, 140]
  const layers = dxfLayers(o)
  layers.forEach((l, i) =>
    d.addLayer(l.name, l.name === MARKS_LAYER_NAME ? 7 : colours[i % colours.length]!, 'CONTINUOUS'),
  )
  d.addLayer(OUTLINE_LAYER, 8, 'CONTINUOUS')
  d.addLayer(TEXT_LAYER, 7, 'CONTINUOUS')

  for (const l of layers) {
    if (!include(l.name)) continue
    d.setActiveLayer(l.name)
    for (const poly of l.polygons) for (const r of poly) d.drawPolyline(dropClosing(r).map(tx), true)
  }
  if (ring && include(OUTLINE_LAYER)) {
    d.setActiveLayer(OUTLINE_LAYER)
    d.drawPolyline(ring.map(tx), true)
  }
  if (include(TEXT_LAYER)) {
    d.setActiveLayer(TEXT_LAYER)
    const font = options.text !== 'font' ? options.font : undefined
    // Outlines are drawn in the chip's frame, then mirrored point by point (glyphs read backwards on the mould,
    // right way round on the cast chip); a reflection reverses the rings, so they are turned back to CCW/CW.
    const drawText = (x: number, y: number, h: number, s: string) => {
      if (font) {
        for (const r of textOutlines(font, s, x, y, h))
          d.drawPolyline((options.mirror ? [...r].reverse() : r).map(tx), true)
      } else {
        const a = asciiText(s)
        const [px, py] = tx([x, y])
        if (a) d.drawText(px, py, h, 0, a)
      }
    }
    for (const t of o.texts) drawText(t.position.x, t.position.y, t.height, t.text)
    const ys = ring ? ring.map(p => p[1]) : [0]
    const x0 = ring ? Math.min(...ring.map(p => p[0])) : 0
    const h = 250
    const lines = [
      `Design: ${doc.name.trim() || 'untitled'}`,
      `Revision: ${options.revision ?? 'draft'}`,
      `Date: ${options.date ?? new Date().toISOString().slice(0, 10)}`,
      `Units: micrometres. Layers: ${layers
        .filter(l => l.depth !== undefined)
        .map(l => l.name)
        .join(', ')}${options.mirror ? '. Mirrored for the mould' : ''}`,
    ]
    lines.forEach((line, i) => drawText(x0, Math.min(...ys) - (i + 2) * h * 1.6, h, line))
  }
  return d.toDxfString()
}
