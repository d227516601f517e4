import { z } from 'zod'
import { channel } from './channels'
import { component } from './components'
import { layer } from './layers'
import { mark } from './marks'
import { operatingPoint } from './operating-points'
import { outline } from './outline'
import { port } from './ports'
import { safeText } from '../text'
import { CHIP_LIMITS as L } from './limits'
import { elementId } from './primitives'

/** The current document version. Bump it together with a new `upgrades/vN-to-vN+1.ts`. */
export const CHIP_DOCUMENT_VERSION = 1 as const

export const LAYERS_REQUIRED = 'A chip needs at least one layer (one per channel depth)'

/** The document's single-valued fields. */
export const documentFields = z.object({
  version: z.literal(CHIP_DOCUMENT_VERSION, {
    error: `Document version must be ${CHIP_DOCUMENT_VERSION} after upgrade`,
  }),
  name: safeText({ error: 'Design name must be a string' }, 'Design name')
    .min(1, { error: 'Design name must not be empty' })
    .max(L.nameChars, { error: `Design name must be at most ${L.nameChars} characters` }),
  units: z.literal('um', { error: 'Document units must be "um" (all lengths in micrometres)' }),
  outline: outline.optional(),
  activeOperatingPoint: elementId.optional(),
})

/** The schema of one element of each list of the document. */
export const ELEMENT_SCHEMAS = {
  layers: layer,
  ports: port,
  channels: channel,
  components: component,
  marks: mark,
  operatingPoints: operatingPoint,
} as const

/** The document's fields, before the cross-reference checks. */
export const chipDocumentShape = z.object({
  version: documentFields.shape.version,
  name: documentFields.shape.name,
  units: documentFields.shape.units,
  layers: z.array(layer).min(1, { error: LAYERS_REQUIRED }),
  ports: z.array(port).default([]),
  channels: z.array(channel).default([]),
  components: z.array(component).default([]),
  outline: documentFields.shape.outline,
  marks: z.array(mark).default([]),
  operatingPoints: z.array(operatingPoint).default([]),
  activeOperatingPoint: documentFields.shape.activeOperatingPoint,
})
export type ChipDocumentShape = z.infer<typeof chipDocumentShape>
