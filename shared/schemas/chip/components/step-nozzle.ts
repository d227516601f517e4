import { z } from 'zod'
import { elementId } from '../primitives'
import { positiveUm } from '../units'
import { componentBase, requireThat } from './common'

/**
 * Step-emulsification nozzle: a shallow nozzle (on `layerId`) from the origin along local +x opens at a step
 * into a deep collection reservoir (on `reservoirLayerId`) that runs along local y, where the continuous
 * phase flows past and carries the drops away.
 */
export const stepNozzle = z
  .object({
    ...componentBase,
    kind: z.literal('step-nozzle'),
    reservoirLayerId: elementId,
    nozzleWidth: positiveUm('Step nozzle width'),
    nozzleLength: positiveUm('Step nozzle length'),
    reservoirWidth: positiveUm('Step reservoir width'),
    reservoirLength: positiveUm('Step reservoir length'),
  })
  .superRefine((c, ctx) => {
    requireThat(
      ctx,
      c.reservoirLayerId !== c.layerId,
      'reservoirLayerId',
      'Step nozzle reservoir must be on a different (deeper) layer than the nozzle',
    )
    requireThat(
      ctx,
      c.reservoirLength >= c.nozzleWidth,
      'reservoirLength',
      `Step reservoir length must be ≥ the nozzle width (${c.nozzleWidth} µm)`,
    )
  })
export type StepNozzle = z.infer<typeof stepNozzle>
