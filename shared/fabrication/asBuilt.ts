// The as-built chip: the revision's document with the depths and widths the fab (or the lab) measured. Pure: the
// server stores it beside the revision, the browser draws it, and the forecast runs on it like on any document.
import type { ChipDocument } from '../schemas/chip'

export interface MeasuredDepth {
  layerId: string
  depthUm: number
}
/** A width measured at a named feature: a channel's `width`, or a component's width field (`nozzleWidth`, …). */
export interface MeasuredWidth {
  elementId: string
  field: string
  widthUm: number
}
export interface AsBuiltMeasurements {
  depths: MeasuredDepth[]
  widths: MeasuredWidth[]
}

/** A place on the chip where a width can be measured, with its drawn value. */
export interface MeasurableWidth {
  elementId: string
  field: string
  label: string
  designedUm: number
}

const words = (field: string) =>
  field
    .replace(/Width$/, '')
    .replace(/([A-Z])/g, ' $1')
    .toLowerCase()
    .trim()

/** Every width a fab can measure: each channel's width and each component's width fields, in drawing order. */
export function measurableWidths(doc: ChipDocument): MeasurableWidth[] {
  const out: MeasurableWidth[] = doc.channels.map(c => ({
    elementId: c.id,
    field: 'width',
    label: `Channel ${c.name ?? c.id}`,
    designedUm: c.width,
  }))
  for (const c of doc.components) {
    for (const [field, value] of Object.entries(c)) {
      if (field.endsWith('Width') && typeof value === 'number')
        out.push({ elementId: c.id, field, label: `${c.name ?? c.id}: ${words(field)} width`, designedUm: value })
    }
  }
  return out
}

export class AsBuiltError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
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
    if (!layer)
      throw new AsBuiltError(
        `depths.${i}.layerId`,
        `No layer "${d.layerId}" on this chip (its layers: ${doc.layers.map(l => l.id).join(', ')})`,
      )
    layer.depth = d.depthUm
  })
  const channels = doc.channels.map(c => ({ ...c }))
  const components = doc.components.map(c => ({ ...c })) as Array<Record<string, unknown> & { id: string }>
  m.widths.forEach((w, i) => {
    const channel = channels.find(c => c.id === w.elementId)
    if (channel && w.field === 'width') {
      channel.width = w.widthUm
      return
    }
    const component = components.find(c => c.id === w.elementId)
    if (!channel && !component)
      throw new AsBuiltError(`widths.${i}.elementId`, `No channel or component "${w.elementId}" on this chip`)
    if (!component || !w.field.endsWith('Width') || typeof component[w.field] !== 'number') {
      const fields = measurableWidths(doc)
        .filter(f => f.elementId === w.elementId)
        .map(f => f.field)
      throw new AsBuiltError(
        `widths.${i}.field`,
        `"${w.elementId}" has no width "${w.field}" (measurable: ${fields.join(', ')})`,
      )
    }
    component[w.field] = w.widthUm
  })
  return { ...doc, layers, channels, components: components as ChipDocument['components'] }
}

/**
 * The component fields behind a junction's forecast widths, main then dispersed inlet (as compiled in
 * shared/physics/document/components.ts). Step nozzles have one width: the nozzle's.
 */
export const JUNCTION_WIDTH_FIELDS: Record<string, { main: string; inlet?: string }> = {
  't-junction': { main: 'mainWidth', inlet: 'inletWidth' },
  'y-junction': { main: 'outletWidth', inlet: 'dispersedWidth' },
  'flow-focusing': { main: 'orificeWidth', inlet: 'dispersedWidth' },
  'step-nozzle': { main: 'nozzleWidth' },
  'step-array': { main: 'nozzleWidth' },
}

/** Sizes measured at the bench on the chip a run was made on, µm. */
export interface BenchSizes {
  mainWidthUm?: number
  inletWidthUm?: number
  depthUm?: number
}

/**
 * The chip with the sizes measured at the bench on one junction: its width fields, and the depth of its layer
 * (every feature on that layer is as deep). `junctionId` may name one nozzle of an array (`sa-1[3]`): the sizes
 * apply to the array's component. Without a junction id, the first junction on the chip.
 */
export function applyBenchSizes(doc: ChipDocument, junctionId: string | undefined, sizes: BenchSizes): ChipDocument {
  const elementId = junctionId?.replace(/\[\d+\]$/, '')
  const component = doc.components.find(c => (elementId ? c.id === elementId : c.kind in JUNCTION_WIDTH_FIELDS))
  if (!component)
    throw new AsBuiltError(
      'junctionId',
      elementId ? `No junction "${elementId}" on this chip` : 'This chip has no junction to measure',
    )
  const fields = JUNCTION_WIDTH_FIELDS[component.kind]
  if (!fields) throw new AsBuiltError('junctionId', `"${component.name ?? component.id}" is not a junction`)
  if (sizes.inletWidthUm !== undefined && !fields.inlet)
    throw new AsBuiltError(
      'asBuilt.inletWidthUm',
      `A ${component.kind.replace('-', ' ')} has one width, the nozzle's: give it as the width at the junction`,
    )
  const widths: MeasuredWidth[] = []
  if (sizes.mainWidthUm !== undefined)
    widths.push({ elementId: component.id, field: fields.main, widthUm: sizes.mainWidthUm })
  if (sizes.inletWidthUm !== undefined)
    widths.push({ elementId: component.id, field: fields.inlet!, widthUm: sizes.inletWidthUm })
  const depths = sizes.depthUm !== undefined ? [{ layerId: component.layerId, depthUm: sizes.depthUm }] : []
  return applyAsBuilt(doc, { depths, widths })
}
