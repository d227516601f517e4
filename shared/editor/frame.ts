// The chip's frame: its outline (the cut piece) and alignment crosses, as named actions.
import type { ChipDocument } from '../schemas/chip'
import { bounds } from './arrays'
import { freshId, usedIds } from './elements'
import type { ActionOutcome, PointUm } from './types'

/** Margin around the drawn parts when an outline is first made, µm (round value, not from a source). */
export const OUTLINE_MARGIN = 2000

/**
 * Set the outline rectangle. Fields not given keep their value; a chip with no rectangle yet gets one around
 * what is drawn with `OUTLINE_MARGIN` to spare (or 10 × 10 mm at the origin when nothing is drawn).
 */
export function setOutline(
  doc: ChipDocument,
  args: { width?: number; height?: number; corner?: PointUm },
): ActionOutcome {
  const o = doc.outline?.kind === 'rectangle' ? doc.outline : null
  const b = o ? null : bounds(doc)
  const start =
    o ??
    (b
      ? {
          corner: { x: b.minX - OUTLINE_MARGIN, y: b.minY - OUTLINE_MARGIN },
          width: b.maxX - b.minX + 2 * OUTLINE_MARGIN,
          height: b.maxY - b.minY + 2 * OUTLINE_MARGIN,
        }
      : { corner: { x: 0, y: 0 }, width: 10000, height: 10000 })
  const outline = {
    kind: 'rectangle' as const,
    corner: args.corner ? { x: args.corner.x, y: args.corner.y } : start.corner,
    width: args.width ?? start.width,
    height: args.height ?? start.height,
  }
  return { doc: { ...doc, outline }, history: 'record' }
}

/** Remove the outline (the chip is then cut around its parts by whoever makes it). */
export function clearOutline(doc: ChipDocument, _args: Record<string, never> = {}): ActionOutcome {
  const { outline: _gone, ...rest } = doc
  return { doc: rest as ChipDocument, history: 'record' }
}

/**
 * Place an alignment cross. By default it is printed on every layer, so the masks of a multi-depth mould line up;
 * 500 µm arms and 50 µm lines are round starting values (not from a source), set exactly in the inspector.
 */
export function placeMark(
  doc: ChipDocument,
  args: { position: PointUm; size?: number; lineWidth?: number; layerIds?: string[]; created?: string[] },
): ActionOutcome {
  const id = freshId(usedIds(doc), 'mark')
  args.created?.push(id)
  const mark = {
    id,
    kind: 'cross' as const,
    position: { x: args.position.x, y: args.position.y },
    size: args.size ?? 500,
    lineWidth: args.lineWidth ?? 50,
    layerIds: args.layerIds ?? doc.layers.map(l => l.id),
  }
  return { doc: { ...doc, marks: [...doc.marks, mark] }, history: 'record' }
}
