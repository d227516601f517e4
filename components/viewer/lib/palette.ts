// Colours for the canvas, taken from the Tailwind tokens so the canvas and the panels share one palette.
import tokens from '~~/tailwind.config'

const c = tokens.theme.extend.colors
export const colors = c

export type Family = 'aqueous' | 'oil' | 'graphite'
type Shade = 300 | 400 | 500 | 600 | 700

export interface LayerStyle {
  family: Family
  shade: Shade
  fill: string
}

const FAMILIES: Family[] = ['aqueous', 'oil', 'graphite']

/**
 * A style per channel layer, by depth: layers sorted shallow → deep take aqueous, oil, graphite in turn, and the
 * shade darkens with depth (300 for the shallowest … 600 for the deepest), so deeper always reads darker.
 * Layers of the same depth still get distinct families.
 */
export function layerStyles(layers: Array<{ id: string; depth: number }>): Map<string, LayerStyle> {
  const sorted = [...layers].sort((a, b) => a.depth - b.depth)
  const depths = [...new Set(sorted.map(l => l.depth))]
  const out = new Map<string, LayerStyle>()
  sorted.forEach((l, rank) => {
    const family = FAMILIES[rank % FAMILIES.length]!
    const d = depths.indexOf(l.depth)
    const shade = (depths.length === 1 ? 400 : 300 + Math.round((d / (depths.length - 1)) * 3) * 100) as Shade
    out.set(l.id, { family, shade, fill: c[family][shade] })
  })
  return out
}

/** Canvas colours that are not per layer. */
export const canvasColors = {
  background: c.graphite[100],
  chip: '#ffffff',
  chipEdge: c.graphite[500],
  marks: c.graphite[800],
  text: c.graphite[700],
  muted: c.graphite[200],
  hover: c.graphite[900],
  selected: c.aqueous[700],
  added: c.aqueous[500],
  removed: c.fault[500],
  changed: c.caution[500],
  changedFill: c.caution[100],
  tone: { ok: c.ok[500], caution: c.caution[500], fault: c.fault[500] },
  toneBg: { ok: c.ok[100], caution: c.caution[100], fault: c.fault[100] },
  severity: { error: c.fault[500], warning: c.caution[500], info: c.aqueous[600] },
  pin: c.graphite[900],
  pinResolved: c.graphite[300],
  pinActive: c.oil[400],
  inletDispersed: c.aqueous[700],
  inletContinuous: c.oil[600],
  outlet: c.graphite[700],
} as const

export const MONO_FONT = '"JetBrains Mono", ui-monospace, monospace'
export const SANS_FONT = '"IBM Plex Sans", system-ui, sans-serif'
