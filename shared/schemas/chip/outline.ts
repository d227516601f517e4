import { z } from 'zod'
import { CHIP_LIMITS as L, shownLimit } from './limits'
import { point } from './primitives'
import { positiveUm } from './units'

/** The chip's outer edge (the diced or cut PDMS/glass piece), in µm. */
export const outline = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('rectangle'),
    corner: point, // lower-left corner
    width: positiveUm('Chip outline width'),
    height: positiveUm('Chip outline height'),
  }),
  z.object({
    kind: z.literal('polygon'),
    points: z
      .array(point)
      .min(3, { error: 'Chip outline polygon needs at least 3 points' })
      .max(L.pointsPerLine, { error: `Chip outline polygon must have at most ${shownLimit(L.pointsPerLine)} points` }),
  }),
])
export type Outline = z.infer<typeof outline>
