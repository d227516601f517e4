import { z } from 'zod'
import { elementId } from '../primitives'
import { CHIP_LIMITS as L } from '../limits'
import { countOf, positiveUm } from '../units'
import { componentBase, requireThat } from './common'

/**
 * A row of `nozzleCount` step nozzles at `pitch`, fed from a supply channel (on `supplyLayerId`, local x < 0)
 * and opening into one deep reservoir (on `reservoirLayerId`); rows run along local y, centred on the origin.
 */
export const stepArray = z
  .object({
    ...componentBase,
    kind: z.literal('step-array'),
    supplyLayerId: elementId,
    reservoirLayerId: elementId,
    nozzleCount: countOf('Step array nozzle count', 1, L.nozzlesPerArray),
    pitch: positiveUm('Step array pitch'),
    nozzleWidth: positiveUm('Step array nozzle width'),
    nozzleLength: positiveUm('Step array nozzle length'),
    supplyWidth: positiveUm('Step array supply width'),
    reservoirWidth: positiveUm('Step array reservoir width'),
    margin: positiveUm('Step array end margin'),
  })
  .superRefine((c, ctx) => {
    requireThat(
      ctx,
      c.pitch > c.nozzleWidth,
      'pitch',
      `Step array pitch must be > the nozzle width (${c.nozzleWidth} µm)`,
    )
    requireThat(
      ctx,
      c.margin >= c.nozzleWidth,
      'margin',
      `Step array end margin must be ≥ the nozzle width (${c.nozzleWidth} µm)`,
    )
    requireThat(
      ctx,
      c.reservoirLayerId !== c.layerId,
      'reservoirLayerId',
      'Step array reservoir must be on a different (deeper) layer than the nozzles',
    )
  })
export type StepArray = z.infer<typeof stepArray>

/** Length of the supply and reservoir channels along local y. */
export const stepArrayLength = (c: StepArray): number => (c.nozzleCount - 1) * c.pitch + 2 * c.margin
