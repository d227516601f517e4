// The chip's set-up beside its drawing: layers (one per depth) and named operating points, as named actions.
import { componentLayerIds, type ChipDocument, type Layer, type OperatingPoint } from '../schemas/chip'
import { clone, freshId, usedIds } from './elements'
import type { ActionOutcome } from './types'

/** Add a layer at a depth (µm); it gets a fresh id and, unless given, a name from its depth. */
export function addLayer(doc: ChipDocument, args: { depth: number; name?: string; created?: string[] }): ActionOutcome {
  const id = freshId(usedIds(doc), 'layer')
  args.created?.push(id)
  const layer: Layer = { id, name: args.name?.trim() || `${args.depth} µm deep`, depth: args.depth }
  return { doc: { ...doc, layers: [...doc.layers, layer] }, history: 'record' }
}

/** Rename a layer or change its depth (µm). */
export function setLayerField(
  doc: ChipDocument,
  args: { id: string; path: 'name' | 'depth'; value: string | number },
): ActionOutcome {
  if (!doc.layers.some(l => l.id === args.id)) throw new Error(`No layer "${args.id}" in this design`)
  return {
    doc: { ...doc, layers: doc.layers.map(l => (l.id === args.id ? { ...l, [args.path]: args.value } : l)) },
    history: 'record',
  }
}

/** Elements drawn on a layer (marks only print on it, so they do not hold it). */
export function elementsOnLayer(doc: ChipDocument, layerId: string): string[] {
  return [
    ...doc.components.filter(c => componentLayerIds(c).includes(layerId)),
    ...doc.ports.filter(p => p.layerId === layerId),
    ...doc.channels.filter(c => c.layerId === layerId),
  ].map(e => e.id)
}

/** Remove an empty layer; marks stop printing on it. A layer still in use is refused, naming what is on it. */
export function removeLayer(doc: ChipDocument, args: { id: string }): ActionOutcome {
  const layer = doc.layers.find(l => l.id === args.id)
  if (!layer) throw new Error(`No layer "${args.id}" in this design`)
  const users = elementsOnLayer(doc, args.id)
  if (users.length)
    throw new Error(
      `Layer "${layer.name}" still holds ${users.slice(0, 5).join(', ')}${users.length > 5 ? ` and ${users.length - 5} more` : ''}: move or delete them first`,
    )
  if (doc.layers.length === 1) throw new Error('A chip needs at least one layer: add another before removing this one')
  const marks = doc.marks.map(m =>
    m.layerIds.includes(args.id) ? { ...m, layerIds: m.layerIds.filter(x => x !== args.id) } : m,
  )
  return { doc: { ...doc, layers: doc.layers.filter(l => l.id !== args.id), marks }, history: 'record' }
}

/** A new operating point copied from `from` (default: the active one) under a fresh id; it becomes the active one. */
export function addOperatingPoint(
  doc: ChipDocument,
  args: { from?: string; name?: string; created?: string[] },
): ActionOutcome {
  const source =
    doc.operatingPoints.find(o => o.id === (args.from ?? doc.activeOperatingPoint)) ?? doc.operatingPoints[0]
  if (!source) throw new Error('This design has no operating point to copy: import or create a design with one')
  const id = freshId(usedIds(doc), 'op')
  args.created?.push(id)
  const op: OperatingPoint = { ...clone(source), id, name: args.name?.trim() || `${source.name} (copy)` }
  return { doc: { ...doc, operatingPoints: [...doc.operatingPoints, op], activeOperatingPoint: id }, history: 'record' }
}

/** Remove an operating point; the design keeps at least one. Removing the active one makes the first left active. */
export function removeOperatingPoint(doc: ChipDocument, args: { id: string }): ActionOutcome {
  const op = doc.operatingPoints.find(o => o.id === args.id)
  if (!op) throw new Error(`No operating point "${args.id}" in this design`)
  if (doc.operatingPoints.length === 1)
    throw new Error(`"${op.name}" is the only operating point: add another before removing it`)
  const operatingPoints = doc.operatingPoints.filter(o => o.id !== args.id)
  const activeOperatingPoint =
    doc.activeOperatingPoint === args.id || !doc.activeOperatingPoint
      ? operatingPoints[0]!.id
      : doc.activeOperatingPoint
  return { doc: { ...doc, operatingPoints, activeOperatingPoint }, history: 'record' }
}
