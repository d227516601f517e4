import { z } from 'zod'
import { safeText } from '../text'
import { CHIP_LIMITS as L, shownLimit } from './limits'
import { elementId, point, terminalRef } from './primitives'
import { positiveUm } from './units'

/** A channel: a centre-line polyline (µm) swept with a constant width on one layer. */
export const channel = z.object({
  id: elementId,
  name: safeText(undefined, 'Channel name')
    .max(L.nameChars, { error: `Channel name must be at most ${L.nameChars} characters` })
    .optional(),
  layerId: elementId,
  width: positiveUm('Channel width'),
  points: z
    .array(point)
    .min(2, { error: 'Channel needs at least 2 points' })
    .max(L.pointsPerLine, {
      error: `Channel must have at most ${shownLimit(L.pointsPerLine)} points: split it into several channels`,
    }),
  start: terminalRef.optional(),
  end: terminalRef.optional(),
})
export type Channel = z.infer<typeof channel>
