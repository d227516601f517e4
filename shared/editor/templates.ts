// Starting parameters for parts placed from the palette (µm). Plain, common sizes for soft-lithography chips:
// chosen as sensible defaults, not taken from a source; the designer sets exact numbers in the inspector.
import type { Component, ChipDocument } from '../schemas/chip'
import type { PointUm } from './types'
import { JUNCTION_KINDS, kindLabel, type JunctionKind } from '../utils/junctionKinds'

/** Parts placed one at a time from the palette: every junction kind but the array (drawn by the array planner). */
export type PlaceableKind = Exclude<JunctionKind, 'step-array'> | 'serpentine'

const PLACEABLE_KINDS: PlaceableKind[] = [
  ...JUNCTION_KINDS.filter((k): k is Exclude<JunctionKind, 'step-array'> => k !== 'step-array'),
  'serpentine',
]
export const PLACEABLE: Array<{ kind: PlaceableKind; label: string }> = PLACEABLE_KINDS.map(kind => ({
  kind,
  label: kind === 'serpentine' ? 'Serpentine' : kindLabel(kind),
}))

/** A new component of `kind` at `position` on `layerId` (step parts need a deeper `reservoirLayerId`). */
export function componentTemplate(
  kind: PlaceableKind,
  id: string,
  position: PointUm,
  layerId: string,
  reservoirLayerId?: string,
): Component {
  const base = { id, position, rotation: 0, layerId }
  switch (kind) {
    case 't-junction':
      return { ...base, kind, mainWidth: 100, inletWidth: 50, armLength: 300 }
    case 'flow-focusing':
      return {
        ...base,
        kind,
        orificeWidth: 40,
        orificeLength: 60,
        continuousWidth: 80,
        dispersedWidth: 80,
        outletWidth: 120,
        armLength: 300,
      }
    case 'y-junction':
      return { ...base, kind, angle: 60, continuousWidth: 100, dispersedWidth: 100, outletWidth: 100, armLength: 300 }
    case 'serpentine':
      return { ...base, kind, turns: 6, pitch: 300, width: 100, totalLength: 12000 }
    case 'step-nozzle':
      return {
        ...base,
        kind,
        reservoirLayerId: reservoirLayerId ?? layerId,
        nozzleWidth: 40,
        nozzleLength: 300,
        reservoirWidth: 1000,
        reservoirLength: 3000,
      }
  }
}

/** The deepest layer other than `layerId`, for a step's reservoir; null when there is none. */
export function deeperLayer(doc: ChipDocument, layerId: string): string | null {
  const own = doc.layers.find(l => l.id === layerId)
  const deeper = doc.layers
    .filter(l => l.id !== layerId && (!own || l.depth > own.depth))
    .sort((a, b) => b.depth - a.depth)
  return deeper[0]?.id ?? null
}
