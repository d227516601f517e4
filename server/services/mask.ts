// The mask file of a revision: merged, closed outlines per depth layer in micrometres (geometry/dxf).
// No h3 (the label font is read once per thread by server/utils/labelFont.ts): it runs in a geometry worker (server/workers/geometry.ts), and in-thread without one.
import { buildOutlines } from '../../geometry/outlines'
import { exportDxf } from '../../geometry/dxf'
import type { ChipDocument } from '#shared/schemas/chip'
import { labelFont } from '../utils/labelFont'

/** What the worker needs of a revision (it is copied to the worker thread). */
export interface MaskInput {
  document: unknown
  number: number
  createdAt: string
  designName: string
  mirror: boolean
  /** Text as outlines (default) or DXF TEXT entities. */
  text?: 'outline' | 'font'
  layers?: string[]
}

export type MaskResult = { ok: true; dxf: string; filename: string } | { ok: false; message: string }

const slug = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 60) || 'design'

export function maskFile(input: MaskInput): MaskResult {
  const doc = input.document as ChipDocument
  const outlines = buildOutlines(doc)
  if (outlines.problems.length) {
    return {
      ok: false,
      message: `This revision's geometry cannot be exported: ${outlines.problems.map(p => p.message).join('; ')}`,
    }
  }
  const date = input.createdAt.slice(0, 10)
  const dxf = exportDxf(doc, {
    mirror: input.mirror,
    layers: input.layers,
    revision: `r${input.number}`,
    date,
    outlines,
    text: input.text ?? 'outline',
    font: input.text === 'font' ? undefined : labelFont(),
  })
  const layerSet = input.layers?.length ? input.layers.map(slug).join('+') : 'all-layers'
  const filename = `${slug(input.designName)}_r${input.number}_${layerSet}${input.mirror ? '_mirrored' : ''}.dxf`
  return { ok: true, dxf, filename }
}
