import { z } from 'zod'
import { positiveUm } from '../units'
import { componentBase, requireThat } from './common'

/**
 * Flow-focusing cross: the dispersed phase arrives along local +x, two continuous arms cross it at the origin
 * (local ±y), then an orifice (`orificeWidth` × `orificeLength`) opens into the outlet channel.
 */
export const flowFocusing = z
  .object({
    ...componentBase,
    kind: z.literal('flow-focusing'),
    orificeWidth: positiveUm('Flow-focusing orifice width'),
    orificeLength: positiveUm('Flow-focusing orifice length'),
    continuousWidth: positiveUm('Flow-focusing continuous width'),
    dispersedWidth: positiveUm('Flow-focusing dispersed width'),
    outletWidth: positiveUm('Flow-focusing outlet width'),
    armLength: positiveUm('Flow-focusing arm length'),
  })
  .superRefine((c, ctx) => {
    const widest = Math.max(c.continuousWidth, c.dispersedWidth, c.outletWidth)
    requireThat(
      ctx,
      c.armLength >= widest,
      'armLength',
      `Flow-focusing arm length must be ≥ the widest channel (${widest} µm)`,
    )
  })
export type FlowFocusing = z.infer<typeof flowFocusing>
