import { z } from 'zod'
import { positiveUm } from '../units'
import { componentBase, requireThat } from './common'

/**
 * Y-junction: two inlet arms separated by `angle` degrees, symmetric about local −x, merge at the origin into
 * an outlet along local +x. The continuous arm is the upper one (local +y side).
 */
export const yJunction = z
  .object({
    ...componentBase,
    kind: z.literal('y-junction'),
    angle: z
      .number({ error: 'Y-junction angle must be a number in degrees' })
      .min(10, { error: 'Y-junction angle must be between 10° and 170°' })
      .max(170, { error: 'Y-junction angle must be between 10° and 170°' }),
    continuousWidth: positiveUm('Y-junction continuous width'),
    dispersedWidth: positiveUm('Y-junction dispersed width'),
    outletWidth: positiveUm('Y-junction outlet width'),
    armLength: positiveUm('Y-junction arm length'),
  })
  .superRefine((c, ctx) => {
    const widest = Math.max(c.continuousWidth, c.dispersedWidth, c.outletWidth)
    requireThat(
      ctx,
      c.armLength >= widest,
      'armLength',
      `Y-junction arm length must be ≥ the widest channel (${widest} µm)`,
    )
  })
export type YJunction = z.infer<typeof yJunction>
