// The as-built chip: the revision's document with the depths and widths the fab (or the lab) measured. Pure: the
// server stores it beside the revision, the browser draws it, and the forecast runs on it like on any document.
import type { ChipDocument } from '../schemas/chip'

export interface MeasuredDepth { layerId: string, depthUm: number }
/** A width measured at a named feature: a channel's `width`, or a component's width field (`nozzleWidth`, …). */
export interface MeasuredWidth { elementId: string, field: string, widthUm: number }
export interface AsBuiltMeasurements { depths: MeasuredDepth[], widths: MeasuredWidth[] }

/** A place on the chip where a width can be measured, with its drawn value. */
export interface MeasurableWidth { elementId: string, field: string, label: string, designedUm: number }

const words = (field: string) => field.replace(/Width$/, '').replace(/([A-Z])/g, ' $1').toLowerCase().trim()

/** Every width a fab can measure: each channel's width and each component's width fields, in drawing order. */
export function measurableWidths(doc: ChipDocument): MeasurableWidth[] {
  const out: MeasurableWidth[] = doc.channels.map(c => ({ elementId: c.id, field: 'width', label: `Channel ${c.name ?? c.id}`, designedUm: c.width }))
  for (const c of doc.components) {
    for (const [field, value] of Object.entries(c)) {
      if (field.endsWith('Width') && typeof value === 'number') out.push({ elementId: c.id, field, label: `${c.name ?? c.id}: ${words(field)} width`, designedUm: value })
    }
  }
  return out
}

export class AsBuiltError extends Error {
  constructor(readonly field: string, message: string) {
    super(message)
    this.name = 'AsBuiltError'
  }
}

/**
 * The document as built: each measured layer depth replaces the layer's depth (every feature on that layer is
 * as deep as the profilometer says), each measured width replaces the drawn width at its feature. Unmeasured
 * values stay as drawn. An unknown layer, element or field is an error naming it.
 */
export function applyAsBuilt(doc: ChipDocument, m: AsBuiltMeasurements): ChipDocument {
  const layers = doc.layers.map(l => ({ ...l }))
  m.depths.forEach((d, i) => {
    const layer = layers.find(l => l.id === d.layerId)
    if (!layer) throw new AsBuiltError(`depths.${i}.layerId`, `No layer "${d.layerId}" on this chip (its layers: ${doc.layers.map(l => l.id).join(', ')})`)
    layer.depth = d.depthUm
  })
  const channels = doc.channels.map(c => ({ ...c }))
  const components = doc.components.map(c => ({ ...c })) as Array<Record<string, unknown> & { id: string }>
  m.widths.forEach((w, i) => {
    const channel = channels.find(c => c.id === w.elementId)
    if (channel && w.field === 'width') { channel.width = w.widthUm; return }
    const component = components.find(c => c.id === w.elementId)
    if (!channel && !component) throw new AsBuiltError(`widths.${i}.elementId`, `No channel or component "${w.elementId}" on this chip`)
    if (!component || !w.field.endsWith('Width') || typeof component[w.field] !== 'number') {
      const fields = measurableWidths(doc).filter(f => f.elementId === w.elementId).map(f => f.field)
      throw new AsBuiltError(`widths.${i}.field`, `"${w.elementId}" has no width "${w.field}" (measurable: ${fields.join(', ')})`)
    }
    component[w.field] = w.widthUm
  })
  return { ...doc, layers, channels, components: components as ChipDocument['components'] }
}
