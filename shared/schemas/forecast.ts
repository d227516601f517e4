// The public forecast request (POST /api/v1/forecast and `npm run forecast`): a single junction or a network.
// Quantities are SI numbers or unit strings (see ./quantity.ts); the parsed output is SI throughout.
import { z } from 'zod'
import { quantityField } from './quantity'

const SURFACTANT = z.enum(['none', 'sorbitan-monooleate', 'fluorinated-block-copolymer'])

export const libraryLiquidRef = z.strictObject({
  liquid: z.string().min(1, 'give a liquid id from GET /api/v1/liquids, e.g. "water"'),
  massFraction: z.number().min(0, 'massFraction is a glycerol mass fraction between 0 and 1').max(1, 'massFraction is a glycerol mass fraction between 0 and 1').optional(),
})

export const explicitLiquid = z.strictObject({
  name: z.string().optional(),
  viscosity: quantityField('viscosity'),
  density: quantityField('density'),
  surfaceTension: quantityField('surfaceTension').optional(),
})

/** A liquid is a library reference ({ "liquid": id }) or explicit properties; which is chosen by the "liquid" key. */
export const liquidInput = z.unknown().transform((input, ctx) => {
  const schema = typeof input === 'object' && input !== null && 'liquid' in input ? libraryLiquidRef : explicitLiquid
  const parsed = schema.safeParse(input)
  if (parsed.success) return parsed.data as z.output<typeof libraryLiquidRef> | z.output<typeof explicitLiquid>
  for (const issue of parsed.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path as (string | number)[] })
  return z.NEVER
})
export type LiquidInput = z.output<typeof liquidInput>

export const junctionGeometry = z.strictObject({
  kind: z.enum(['t-junction', 'flow-focusing', 'step']),
  /** Main channel width (t-junction), orifice width (flow-focusing) or nozzle width (step). */
  mainWidth: quantityField('length'),
  /** Dispersed-phase inlet width; defaults to mainWidth. */
  inletWidth: quantityField('length').optional(),
  /** Channel (or nozzle) depth. */
  depth: quantityField('length'),
})

export const junctionRequest = z.strictObject({
  junction: junctionGeometry,
  continuous: liquidInput,
  dispersed: liquidInput,
  interfacialTension: quantityField('surfaceTension').optional(),
  surfactant: SURFACTANT.optional(),
  contactAngle: quantityField('angle', { min: 0, max: Math.PI }).optional(),
  temperature: quantityField('temperature', { positive: true }).optional(),
  flow: z.strictObject({ continuous: quantityField('volumeFlow'), dispersed: quantityField('volumeFlow') }),
  model: z.strictObject({ alpha: z.number().positive('alpha must be > 0; fit it from measured droplets or omit it').finite().optional() }).optional(),
})
export type JunctionRequest = z.output<typeof junctionRequest>

const rectangularChannel = z.strictObject({
  id: z.string().min(1),
  from: z.string().min(1),
  to: z.string().min(1),
  width: quantityField('length'),
  depth: quantityField('length'),
  length: quantityField('length'),
})
const tubing = z.strictObject({
  id: z.string().min(1),
  from: z.string().min(1),
  to: z.string().min(1),
  diameter: quantityField('length'),
  length: quantityField('length'),
})

export const networkSource = z.union([
  z.strictObject({ node: z.string().min(1), pressure: quantityField('pressure', { positive: false }) }),
  z.strictObject({ node: z.string().min(1), flow: quantityField('volumeFlow', { positive: false }) }),
])

export const networkRequest = z.strictObject({
  network: z.strictObject({
    channels: z.array(z.union([rectangularChannel, tubing])).min(1, 'a network needs at least one channel'),
    sources: z.array(networkSource).min(1, 'a network needs at least one pressure source (an outlet at 0 Pa)'),
    liquid: liquidInput,
    temperature: quantityField('temperature', { positive: true }).optional(),
    /** "series" (exact, default) or "approximate" (Bruus's closed form). */
    resistanceMethod: z.enum(['series', 'approximate']).optional(),
    /** Sets of channel ids meant to carry equal flow (parallel nozzles). */
    parallelSets: z.array(z.array(z.string()).min(2)).optional(),
    limits: z.strictObject({ bondPressure: quantityField('pressure').optional(), pumpPressure: quantityField('pressure').optional() }).optional(),
  }),
})
export type NetworkRequest = z.output<typeof networkRequest>

export const documentRequest = z.strictObject({
  document: z.unknown(),
  operatingPoint: z.string().min(1, 'name the operating point to forecast'),
})
export type DocumentRequest = z.output<typeof documentRequest>
