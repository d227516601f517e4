import { z } from 'zod'
import { safeText } from '../text'
import { CHIP_LIMITS as L } from './limits'
import { elementId } from './primitives'
import { positiveUm } from './units'

/** One layer per channel depth: every feature drawn on it is etched or moulded to `depth` µm. */
export const layer = z.object({
  id: elementId,
  name: safeText({ error: 'Layer name must be a string' }, 'Layer name')
    .min(1, { error: 'Layer name must not be empty' })
    .max(L.nameChars, { error: `Layer name must be at most ${L.nameChars} characters` }),
  depth: positiveUm('Layer depth', L.depthUm),
})
export type Layer = z.infer<typeof layer>
