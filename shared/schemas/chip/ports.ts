import { z } from 'zod'
import { CHIP_LIMITS as L } from './limits'
import { elementId, point } from './primitives'
import { positiveUm } from './units'

/** Which liquid phase an inlet carries; how it is driven (pressure or flow) is set per operating point. */
export const phase = z.enum(['continuous', 'dispersed'])
export type Phase = z.infer<typeof phase>

export const port = z.object({
  id: elementId,
  kind: z.enum(['inlet', 'outlet'], { error: 'Port kind must be "inlet" or "outlet"' }),
  position: point,
  punchDiameter: positiveUm('Port punch diameter', L.punchDiameterUm),
  layerId: elementId,
  feed: z.object({ phase }).optional(),
})
export type Port = z.infer<typeof port>
