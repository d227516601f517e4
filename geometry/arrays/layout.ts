import type { ChipDocumentInput } from '#shared/schemas/chip'
import type { Box, Elements } from './elements'
import { elementsBox, shiftElements } from './elements'
import { waferFor } from './wafer'
import type { WaferFit } from './wafer'

/** Space between the boxes of neighbouring banks, µm: above the 1,000 µm punch spacing of the built-in processes. */
export const BANK_GAP = 1500
/** Chip edge to the nearest bank box, µm: punches stay ≥ 1,000 µm from the edge, marks fit in the border. */
export const CHIP_MARGIN = 2000

/**
 * Places banks on a grid of equal cells (the largest bank's box plus `gap`), filled row by row from the bottom
 * left. The column count is the one whose chip has the shortest diagonal, so the chip fits the smallest wafer.
 */
export function gridBanks(
  banks: readonly Elements[],
  componentReach: number,
  gap = BANK_GAP,
): { banks: Elements[]; columns: number; rows: number } {
  if (banks.length === 0) return { banks: [], columns: 0, rows: 0 }
  const boxes = banks.map(b => elementsBox(b, componentReach))
  const cw = Math.max(...boxes.map(b => b.x1 - b.x0)) + gap
  const ch = Math.max(...boxes.map(b => b.y1 - b.y0)) + gap
  let columns = 1
  let best = Infinity
  for (let c = 1; c <= banks.length; c++) {
    const r = Math.ceil(banks.length / c)
    const d = Math.hypot(c * cw - gap, r * ch - gap)
    if (d < best - 1e-9) {
      best = d
      columns = c
    }
  }
  const placed = banks.map((b, i) => {
    const box = boxes[i]!
    return shiftElements(b, (i % columns) * cw - box.x0, Math.floor(i / columns) * ch - box.y0)
  })
  return { banks: placed, columns, rows: Math.ceil(banks.length / columns) }
}

export interface ChipFrame {
  outline: NonNullable<ChipDocumentInput['outline']>
  marks: NonNullable<ChipDocumentInput['marks']>
  /** Chip size, µm. */
  width: number
  height: number
  wafer: WaferFit
}

/** A rectangular chip outline around the placed banks with `CHIP_MARGIN`, two alignment crosses and a label. */
export function frameChip(
  banks: readonly Elements[],
  componentReach: number,
  label: string,
  markLayers: string[],
): ChipFrame {
  const all = banks.map(b => elementsBox(b, componentReach))
  const box: Box = {
    x0: Math.min(...all.map(b => b.x0)) - CHIP_MARGIN,
    y0: Math.min(...all.map(b => b.y0)) - CHIP_MARGIN,
    x1: Math.max(...all.map(b => b.x1)) + CHIP_MARGIN,
    y1: Math.max(...all.map(b => b.y1)) + CHIP_MARGIN,
  }
  const width = Math.ceil(box.x1 - box.x0)
  const height = Math.ceil(box.y1 - box.y0)
  const mark = (id: string, x: number, y: number) => ({
    id,
    kind: 'cross' as const,
    position: { x, y },
    size: 400,
    lineWidth: 40,
    layerIds: markLayers,
  })
  return {
    outline: { kind: 'rectangle', corner: { x: box.x0, y: box.y0 }, width, height },
    marks: [
      mark('align-a', box.x0 + 700, box.y0 + 700),
      mark('align-b', box.x0 + width - 700, box.y0 + height - 700),
      {
        id: 'label',
        kind: 'text',
        position: { x: box.x0 + 1500, y: box.y0 + 500 },
        text: label,
        height: 300,
        layerIds: [],
      },
    ],
    width,
    height,
    wafer: waferFor(width, height),
  }
}

/** The design name, with the wafer it needs when that is more than a 100 mm wafer; and the matching warning. */
export function waferNote(name: string, f: ChipFrame): { name: string; warnings: string[] } {
  const size = `${(f.width / 1000).toFixed(1)} × ${(f.height / 1000).toFixed(1)} mm`
  if (f.wafer.diameterMm !== null && f.wafer.diameterMm <= 100) return { name, warnings: [] }
  const need = f.wafer.diameterMm === null ? 'a wafer larger than 300 mm' : `a ${f.wafer.diameterMm} mm wafer`
  return {
    name: `${name} (needs ${need})`.slice(0, 200),
    warnings: [
      `The chip is ${size} (diagonal ${f.wafer.diagonalMm.toFixed(1)} mm) and does not fit a 100 mm wafer: it needs ${need}; use fewer nozzles per chip or a larger wafer`,
    ],
  }
}
