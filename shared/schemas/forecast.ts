// The public forecast request (POST /api/v1/forecast and `npm run forecast`): a single junction or a network.
// Quantities are SI numbers or unit strings (see ./quantity.ts); the parsed output is SI throughout.
import { z } from 'zod'
import { quantityField } from './quantity'
import { surfactantId } from './libraries'
import { safeText } from './text'

/** Bounds of a forecast request (common practice, no source): a network solve grows with its size. */
export const FORECAST_LIMITS = {
  channels: 20_000,
  sources: 2_000,
  parallelSets: 1_000,
  idChars: 64,
  nameChars: 200,
} as const

/** An id of a channel or node in a network request. */
const netId = (what: string) =>
  safeText(undefined, what)
    .min(1, `${what} must not be empty`)
    .max(FORECAST_LIMITS.idChars, `${what} is at most ${FORECAST_LIMITS.idChars} characters`)
const label = safeText().max(FORECAST_LIMITS.nameChars, `a name is at most ${FORECAST_LIMITS.nameChars} characters`)

// Any surfactant id: a built-in one, or one of the lab's pairs with ?lab= (an unknown pair is named when resolved).
const SURFACTANT = surfactantId

export const libraryLiquidRef = z.strictObject({
  liquid: safeText()
    .min(1, 'give a liquid id from GET /api/v1/liquids, e.g. "water"')
    .max(FORECAST_LIMITS.idChars, `a liquid id is at most ${FORECAST_LIMITS.idChars} characters`),
  massFraction: z
    .number()
    .min(0, 'massFraction is a glycerol mass fraction between 0 and 1')
    .max(1, 'massFraction is a glycerol mass fraction between 0 and 1')
    .optional(),
})

export const explicitLiquid = z.strictObject({
  name: label.optional(),
  viscosity: quantityField('viscosity'),
  density: quantityField('density'),
  surfaceTension: quantityField('surfaceTension').optional(),
})

/**
 * One of two shapes, chosen by whether the object has the key `has`: its issues then name the field and say
 * what is wrong with it, where a plain union could only say that neither shape fits.
 */
function byKey<A extends z.ZodType, B extends z.ZodType>(has: string, ifHas: A, otherwise: B) {
  return z.unknown().transform((input, ctx) => {
    const schema: z.ZodType = typeof input === 'object' && input !== null && has in input ? ifHas : otherwise
    const parsed = schema.safeParse(input)
    if (parsed.success) return parsed.data as z.output<A> | z.output<B>
    for (const issue of parsed.error.issues)
      ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path as (string | number)[] })
    return z.NEVER
  })
}

/** A liquid is a library reference ({ "liquid": id }) or explicit properties; which is chosen by the "liquid" key. */
export const liquidInput = byKey('liquid', libraryLiquidRef, explicitLiquid)
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
  model: z
    .strictObject({
      alpha: z
        .number()
        .positive('alpha must be > 0; fit it from measured droplets or omit it')
        .max(100, 'alpha must be at most 100; fit it from measured droplets or omit it')
        .optional(),
    })
    .optional(),
})
export type JunctionRequest = z.output<typeof junctionRequest>

const rectangularChannel = z.strictObject({
  id: netId('a channel id'),
  from: netId('a node id'),
  to: netId('a node id'),
  width: quantityField('length'),
  depth: quantityField('length'),
  length: quantityField('length'),
})
const tubing = z.strictObject({
  id: netId('a channel id'),
  from: netId('a node id'),
  to: netId('a node id'),
  diameter: quantityField('length'),
  length: quantityField('length'),
})

/** A pressure source ({ node, pressure }) or a flow source ({ node, flow }), chosen by the "flow" key. */
export const networkSource = byKey(
  'flow',
  z.strictObject({ node: netId('a node id'), flow: quantityField('volumeFlow', { positive: false }) }),
  z.strictObject({ node: netId('a node id'), pressure: quantityField('pressure', { positive: false }) }),
)

/** Channel ids name flows, parallel sets and answers: two channels with one id would make them ambiguous. */
function uniqueChannelIds(channels: readonly { id: string }[], ctx: z.RefinementCtx): void {
  const first = new Map<string, number>()
  channels.forEach((channel, k) => {
    const earlier = first.get(channel.id)
    if (earlier === undefined) first.set(channel.id, k)
    else
      ctx.addIssue({
        code: 'custom',
        path: [k, 'id'],
        message: `channel id "${channel.id}" is already used by channel ${earlier}; give every channel its own id`,
      })
  })
}

export const networkRequest = z.strictObject({
  network: z.strictObject({
    channels: z
      .array(byKey('diameter', tubing, rectangularChannel))
      .min(1, 'a network needs at least one channel')
      .max(FORECAST_LIMITS.channels, `a network can have at most ${FORECAST_LIMITS.channels} channels`)
      .superRefine(uniqueChannelIds),
    sources: z
      .array(networkSource)
      .min(1, 'a network needs at least one pressure source (an outlet at 0 Pa)')
      .max(FORECAST_LIMITS.sources, `a network can have at most ${FORECAST_LIMITS.sources} sources`),
    liquid: liquidInput,
    temperature: quantityField('temperature', { positive: true }).optional(),
    /** "series" (exact, default) or "approximate" (Bruus's closed form). */
    resistanceMethod: z.enum(['series', 'approximate']).optional(),
    /** Sets of channel ids meant to carry equal flow (parallel nozzles). */
    parallelSets: z
      .array(z.array(netId('a channel id')).min(2).max(FORECAST_LIMITS.channels))
      .max(FORECAST_LIMITS.parallelSets, `at most ${FORECAST_LIMITS.parallelSets} parallel sets`)
      .optional(),
    limits: z
      .strictObject({
        bondPressure: quantityField('pressure').optional(),
        pumpPressure: quantityField('pressure').optional(),
      })
      .optional(),
  }),
})
export type NetworkRequest = z.output<typeof networkRequest>

export const documentRequest = z.strictObject({
  document: z.unknown(),
  operatingPoint: safeText()
    .min(1, 'name the operating point to forecast')
    .max(FORECAST_LIMITS.idChars, `an operating point id is at most ${FORECAST_LIMITS.idChars} characters`),
})
export type DocumentRequest = z.output<typeof documentRequest>
