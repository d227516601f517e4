import { z } from 'zod'
import { positiveUm } from '../units'
import { componentBase, requireThat } from './common'

/**
 * T-junction: a straight main channel (continuous phase, along local +x) and a perpendicular side inlet
 * (dispersed phase, from local +y) meeting at the origin. Each arm reaches `armLength` µm from the centre.
 */
export const tJunction = z
  .object({
    ...componentBase,
    kind: z.literal('t-junction'),
    mainWidth: positiveUm('T-junction main width'),
    inletWidth: positiveUm('T-junction inlet width'),
    armLength: positiveUm('T-junction arm length'),
  })
  .superRefine((c, ctx) => {
    const widest = Math.max(c.mainWidth, c.inletWidth)
    requireThat(
      ctx,
      c.armLength >= widest,
      'armLength',
      `T-junction arm length must be ≥ the widest channel (${widest} µm) so each arm leaves the junction`,
    )
  })
export type TJunction = z.infer<typeof tJunction>
