// Payloads of the as-built report: measured depths per layer and widths at named features.
import { z } from 'zod'
import { CHIP_LIMITS } from './chip/limits'
import { elementId } from './chip/primitives'
import { labParams } from './labs'
import { safeText } from './text'

export const asBuiltParams = labParams.extend({
  revisionId: z.uuid('Revision id must be a UUID'),
  asBuiltId: z.uuid('As-built id must be a UUID'),
})

const measuredUm = (what: string, max: number) =>
  z
    .number({ error: `${what} must be a number of µm` })
    .finite(`${what} must be a finite number of µm`)
    .positive(`${what} must be > 0 µm`)
    .max(max, `${what} must be at most ${max} µm`)

export const asBuiltCreate = z
  .object({
    depths: z
      .array(z.object({ layerId: elementId, depthUm: measuredUm('Measured depth', 5000) }))
      .max(CHIP_LIMITS.layers, `At most ${CHIP_LIMITS.layers} layer depths`)
      .default([]),
    widths: z
      .array(
        z.object({
          elementId,
          field: safeText(undefined, 'Width field').regex(
            /^(width|[a-z][A-Za-z]*Width)$/,
            'Width field must be "width" or a component width such as "nozzleWidth"',
          ),
          widthUm: measuredUm('Measured width', 100_000),
        }),
      )
      .max(500, 'At most 500 measured widths')
      .default([]),
    note: safeText(undefined, 'Note').max(2000, 'A note is at most 2000 characters').default(''),
  })
  .refine(b => b.depths.length + b.widths.length > 0, {
    message: 'Give at least one measured depth or width',
    path: ['depths'],
  })
export type AsBuiltCreate = z.input<typeof asBuiltCreate>
