import { z } from 'zod'
import { elementId } from './primitives'
import { positiveUm } from './units'

/** One layer per channel depth: every feature drawn on it is etched or moulded to `depth` µm. */
export const layer = z.object({
  id: elementId,
  name: z.string().min(1, { error: 'Layer name must not be empty' }),
  depth: positiveUm('Layer depth'),
})
export type Layer = z.infer<typeof layer>
