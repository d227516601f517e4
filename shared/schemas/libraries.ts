// Payloads of the lab-library API (the lab's own liquids, liquid pairs and fabrication processes). One schema per
// payload, shared by the form on the Libraries page and the routes. Every number carries its unit in its name.
import { z } from 'zod'
import { labParams } from './labs'
import { safeText } from './text'

export const libraryEntryParams = labParams.extend({ entryId: z.uuid('Library entry id must be a UUID') })

/** The source a lab gives for its own measurement; any other citation is as valid. */
export const MEASURED_IN_OUR_LAB = 'measured in our lab'
export const LIBRARY_KINDS = ['liquid', 'pair', 'process'] as const
export type LibraryKind = (typeof LIBRARY_KINDS)[number]
/** At most this many entries per lab (archived ones included): a library, not a database of every lot. */
export const MAX_LIBRARY_ENTRIES = 300
export const MAX_TABLE_ROWS = 40

const text = (what: string, max: number) =>
  safeText({ error: `${what} must be text` }, what)
    .trim()
    .min(1, `${what} is required`)
    .max(max, `${what} is at most ${max} characters`)
const between = (what: string, unit: string, min: number, max: number) =>
  z
    .number({ error: `${what} must be a number in ${unit}` })
    .min(min, `${what} must be at least ${min} ${unit}`)
    .max(max, `${what} must be at most ${max} ${unit}`)
const positive = (what: string, unit: string, max: number) =>
  z
    .number({ error: `${what} must be a number in ${unit}` })
    .positive(`${what} must be above 0 ${unit}`)
    .max(max, `${what} must be at most ${max} ${unit}`)

const source = text('Source', 300).describe(
  `where the values come from: a citation, a datasheet, or "${MEASURED_IN_OUR_LAB}"`,
)
/** Short id typed by the admin; stored and used by documents as "lab-<slug>". */
const slug = z
  .string({ error: 'Short id must be text' })
  .regex(
    /^[a-z0-9][a-z0-9-]{0,46}$/,
    'Short id: 1–47 lower-case letters, digits or hyphens, starting with a letter or digit (e.g. "oil-lot-7")',
  )

export const labLiquidRow = z.strictObject({
  temperatureC: between('Temperature', '°C', -40, 200),
  viscosityMPaS: positive('Viscosity', 'mPa·s', 100_000),
  densityKgPerM3: between('Density', 'kg/m³', 100, 5000),
  surfaceTensionMNPerM: positive('Surface tension', 'mN/m', 100).optional(),
})

const rows = z
  .array(labLiquidRow, { error: 'Give a table of measured rows' })
  .min(1, 'Give at least one row: temperature, viscosity and density')
  .max(MAX_TABLE_ROWS, `At most ${MAX_TABLE_ROWS} rows`)
  .superRefine((table, ctx) => {
    const seen = new Set<number>()
    table.forEach((row, i) => {
      if (seen.has(row.temperatureC))
        ctx.addIssue({
          code: 'custom',
          path: [i, 'temperatureC'],
          message: `Row ${i + 1}: ${row.temperatureC} °C is already in the table; give each temperature once`,
        })
      seen.add(row.temperatureC)
    })
    const withTension = table.filter(r => r.surfaceTensionMNPerM !== undefined).length
    if (withTension > 0 && withTension < table.length) {
      ctx.addIssue({
        code: 'custom',
        path: [table.findIndex(r => r.surfaceTensionMNPerM === undefined), 'surfaceTensionMNPerM'],
        message: 'Give the surface tension on every row or on none',
      })
    }
  })

const liquidFields = { name: text('Name', 120), source, table: rows }
const liquidId = text('Liquid', 64)
/** A surfactant as documents, pairs and the forecast API name it: a built-in one or one a lab names in its pairs. */
export const surfactantId = z
  .string({ error: 'Surfactant must be text' })
  .regex(
    /^[a-z0-9][a-z0-9-]{0,62}$/,
    'Surfactant: lower-case letters, digits or hyphens (e.g. "none", "sorbitan-monooleate", "our-fluoro-surfactant")',
  )

const pairFields = {
  liquids: z
    .tuple([liquidId, liquidId], { error: 'Name the two liquids of the pair (dispersed, continuous)' })
    .refine(([a, b]) => a !== b, { message: 'The pair needs two different liquids', path: [1] }),
  surfactant: surfactantId,
  interfacialTensionMNPerM: positive('Interfacial tension', 'mN/m', 100),
  source,
}
const processFields = {
  name: text('Name', 120),
  material: z.enum(['PDMS', 'glass', 'thermoplastic'], { error: 'Material must be PDMS, glass or thermoplastic' }),
  minFeature: positive('Smallest feature', 'µm', 10_000),
  minGap: positive('Smallest gap', 'µm', 10_000),
  minDepth: positive('Smallest depth', 'µm', 10_000),
  maxDepth: positive('Largest depth', 'µm', 10_000),
  maxWidthToDepth: positive('Largest width/depth ratio', '(ratio)', 1000),
  maxWallDepthToWidth: positive('Largest wall depth/width ratio', '(ratio)', 1000),
  portEdgeDistance: positive('Port to chip edge', 'µm', 100_000),
  portSpacing: positive('Port spacing', 'µm', 100_000),
  bondPressureLimitMbar: positive('Bond pressure limit', 'mbar', 100_000),
  source,
}
const depthsInOrder = (p: { minDepth: number; maxDepth: number }) => p.minDepth <= p.maxDepth

export const labLiquidValues = z.strictObject(liquidFields)
export const labPairValues = z.strictObject(pairFields)
export const labProcessValues = z
  .strictObject(processFields)
  .refine(depthsInOrder, { message: 'Largest depth must be at least the smallest depth', path: ['maxDepth'] })

/** POST /api/labs/:labId/libraries: a new entry. Liquids and processes get a short id, stored as "lab-<id>". */
export const libraryEntryCreateBody = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('liquid'), key: slug, ...liquidFields }),
    z.strictObject({ kind: z.literal('pair'), ...pairFields }),
    z
      .strictObject({ kind: z.literal('process'), key: slug, ...processFields })
      .refine(depthsInOrder, { message: 'Largest depth must be at least the smallest depth', path: ['maxDepth'] }),
  ],
  { error: 'kind must be "liquid", "pair" or "process"' },
)
export type LibraryEntryCreateBody = z.infer<typeof libraryEntryCreateBody>

/** PATCH /api/labs/:labId/libraries/:entryId: the entry's new values (its kind and short id stay). */
export const libraryEntryUpdateBody = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('liquid'), ...liquidFields }),
    z.strictObject({ kind: z.literal('pair'), ...pairFields }),
    z
      .strictObject({ kind: z.literal('process'), ...processFields })
      .refine(depthsInOrder, { message: 'Largest depth must be at least the smallest depth', path: ['maxDepth'] }),
  ],
  { error: 'kind must be "liquid", "pair" or "process"' },
)
export type LibraryEntryUpdateBody = z.infer<typeof libraryEntryUpdateBody>

/** POST /api/labs/:labId/libraries/:entryId/archive: archive (true) or restore (false). */
export const libraryArchiveBody = z.strictObject({ archived: z.boolean({ error: 'archived must be true or false' }) })

/** GET /api/v1/liquids?lab=<uuid>: the built-in library, plus that lab's entries. */
export const liquidsQuery = z.strictObject({
  lab: z.uuid('lab must be the UUID of a lab you are a member of').optional(),
})
/** POST /api/v1/forecast?lab=<uuid>: forecast with that lab's liquids and pairs too. */
export const forecastQuery = liquidsQuery
/** POST /api/v1/plan?lab=<uuid>: plan with that lab's liquids, pairs and processes too. */
export const planQuery = liquidsQuery

/** One entry as the API shows it. */
export interface LibraryEntryView {
  id: string
  kind: LibraryKind
  /** What documents name: "lab-…" for liquids and processes; "<a>/<b>/<surfactant>" for pairs. */
  key: string
  name: string
  source: string
  values: Record<string, unknown>
  archived: boolean
  updatedAt: string
  updatedByName: string
}

export const pairKey = (liquids: readonly [string, string], surfactant: string) =>
  `${[...liquids].sort().join('/')}/${surfactant}`
