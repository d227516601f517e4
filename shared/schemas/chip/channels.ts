import { z } from 'zod'
import { elementId, point, terminalRef } from './primitives'
import { positiveUm } from './units'

/** A channel: a centre-line polyline (µm) swept with a constant width on one layer. */
export const channel = z.object({
  id: elementId,
  name: z.string().optional(),
  layerId: elementId,
  width: positiveUm('Channel width'),
  points: z.array(point).min(2, { error: 'Channel needs at least 2 points' }),
  start: terminalRef.optional(),
  end: terminalRef.optional(),
})
export type Channel = z.infer<typeof channel>
