import { z } from 'zod'
import { CHIP_LIMITS as L } from '../limits'
import { countOf, positiveUm } from '../units'
import { componentBase, requireThat } from './common'

/**
 * Serpentine resistor: `turns` U-turns joining `turns + 1` straight runs along local x, runs `pitch` µm apart
 * (centre to centre) stacked towards local +y, with a centre-line length of `totalLength` µm. Starts at the
 * origin heading +x.
 */
export const serpentine = z
  .object({
    ...componentBase,
    kind: z.literal('serpentine'),
    turns: countOf('Serpentine turns', 1, L.serpentineTurns),
    pitch: positiveUm('Serpentine pitch'),
    width: positiveUm('Serpentine width'),
    totalLength: positiveUm('Serpentine total length'),
  })
  .superRefine((c, ctx) => {
    requireThat(
      ctx,
      c.pitch > c.width,
      'pitch',
      `Serpentine pitch must be > its width (${c.width} µm) or the runs touch`,
    )
    requireThat(
      ctx,
      serpentineRunLength(c) > 0,
      'totalLength',
      `Serpentine total length must be > ${((c.turns * Math.PI * c.pitch) / 2).toFixed(1)} µm (the turns alone)`,
    )
  })
export type Serpentine = z.infer<typeof serpentine>

/**
 * Length of each straight run. Each U-turn is a semicircle of radius pitch/2, arc length π·pitch/2
 * (circle arc length = radius × angle, elementary geometry).
 */
export const serpentineRunLength = (c: Pick<Serpentine, 'turns' | 'pitch' | 'totalLength'>): number =>
  (c.totalLength - (c.turns * Math.PI * c.pitch) / 2) / (c.turns + 1)
