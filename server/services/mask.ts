// The mask file of a revision: merged, closed outlines per depth layer in micrometres (geometry/dxf).
import { createError } from 'h3'
import { buildOutlines } from '../../geometry/outlines'
import { exportDxf } from '../../geometry/dxf'
import type { ChipDocument } from '../../shared/schemas/chip'
import type { RevisionDetail } from '../../shared/types/designs'

const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'design'

export function revisionDxf(revision: RevisionDetail, options: { mirror: boolean, layers?: string[] }) {
  const doc = revision.document as ChipDocument
  const outlines = buildOutlines(doc)
  if (outlines.problems.length) {
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: `This revision's geometry cannot be exported: ${outlines.problems.map(p => p.message).join('; ')}` })
  }
  const date = revision.createdAt.slice(0, 10)
  const dxf = exportDxf(doc, { mirror: options.mirror, layers: options.layers, revision: `r${revision.number}`, date, outlines })
  const layerSet = options.layers?.length ? options.layers.map(slug).join('+') : 'all-layers'
  const filename = `${slug(revision.designName)}_r${revision.number}_${layerSet}${options.mirror ? '_mirrored' : ''}.dxf`
  return { dxf, filename }
}
