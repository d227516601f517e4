import { z } from 'zod'
import { channel } from './channels'
import { component } from './components'
import { layer } from './layers'
import { mark } from './marks'
import { operatingPoint } from './operating-points'
import { outline } from './outline'
import { port } from './ports'
import { elementId } from './primitives'

/** The current document version. Bump it together with a new `upgrades/vN-to-vN+1.ts`. */
export const CHIP_DOCUMENT_VERSION = 1 as const

/** The document's fields, before the cross-reference checks. */
export const chipDocumentShape = z.object({
  version: z.literal(CHIP_DOCUMENT_VERSION, { error: `Document version must be ${CHIP_DOCUMENT_VERSION} after upgrade` }),
  name: z.string().min(1, { error: 'Design name must not be empty' }).max(200),
  units: z.literal('um', { error: 'Document units must be "um" (all lengths in micrometres)' }),
  layers: z.array(layer).min(1, { error: 'A chip needs at least one layer (one per channel depth)' }),
  ports: z.array(port).default([]),
  channels: z.array(channel).default([]),
  components: z.array(component).default([]),
  outline: outline.optional(),
  marks: z.array(mark).default([]),
  operatingPoints: z.array(operatingPoint).default([]),
  activeOperatingPoint: elementId.optional(),
})
export type ChipDocumentShape = z.infer<typeof chipDocumentShape>
