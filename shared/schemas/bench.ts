// Payloads of the bench-results API (bench runs, CSV import, micrographs, the forecast switch). One schema per
// payload, shared by the forms and the routes.
import { z } from 'zod'
import { elementId } from './chip/primitives'
import { labParams } from './labs'
import { safeText } from './text'

export const benchRunParams = labParams.extend({ runId: z.uuid('Bench run id must be a UUID') })
export const micrographParams = benchRunParams.extend({ micrographId: z.uuid('Micrograph id must be a UUID') })

/** Units a measured size may be typed in, and their factor to µm. */
export const SIZE_UNITS = { um: 1, mm: 1000, nm: 0.001 } as const
export type SizeUnit = keyof typeof SIZE_UNITS
export const SIZE_UNIT_LABELS: Record<SizeUnit, string> = { um: 'µm', mm: 'mm', nm: 'nm' }

/** At most this many measured sizes per run (a micrograph of 2048 × 2048 px holds a few thousand drops). */
export const MAX_VALUES = 20_000
/** Measured sizes: above 0, below 10 mm (no droplet chip makes larger drops). */
export const MAX_SIZE_UM = 10_000

const flowRate = (what: string) =>
  z.object({
    value: z
      .number({ error: `${what} must be a number` })
      .positive({ error: `${what} must be > 0` })
      .max(100_000, { error: `${what} must be at most 100000` }),
    unit: z.enum(['uL/min', 'uL/h', 'nL/min'], { error: `${what} unit must be "uL/min", "uL/h" or "nL/min"` }),
  })
const shortText = (what: string, max = 120) =>
  safeText(undefined, what).trim().max(max, `${what} is at most ${max} characters`)

/** What was really set at the bench (it may differ from the design's operating point). */
export const benchConditions = z
  .object({
    continuousFlow: flowRate('Continuous flow rate').optional(),
    dispersedFlow: flowRate('Dispersed flow rate').optional(),
    continuousPressureMbar: z
      .number()
      .nonnegative({ error: 'Continuous pressure must be ≥ 0 mbar' })
      .max(100_000)
      .optional(),
    dispersedPressureMbar: z
      .number()
      .nonnegative({ error: 'Dispersed pressure must be ≥ 0 mbar' })
      .max(100_000)
      .optional(),
    temperatureC: z
      .number()
      .min(-20, { error: 'Temperature must be between −20 °C and 150 °C' })
      .max(150, { error: 'Temperature must be between −20 °C and 150 °C' })
      .optional(),
    continuousLiquid: shortText('Continuous liquid').optional(),
    dispersedLiquid: shortText('Dispersed liquid').optional(),
    surfactant: shortText('Surfactant').optional(),
  })
  .strict()
  .superRefine((c, ctx) => {
    // An inlet is driven by flow or by pressure, not both: a phase gets one of the two.
    if (c.continuousFlow && c.continuousPressureMbar !== undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['continuousPressureMbar'],
        message: 'Give the continuous phase its flow or its pressure, not both',
      })
    if (c.dispersedFlow && c.dispersedPressureMbar !== undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['dispersedPressureMbar'],
        message: 'Give the dispersed phase its flow or its pressure, not both',
      })
  })
export type BenchConditions = z.infer<typeof benchConditions>

/**
 * Sizes measured at the bench on the chip the run was made on, µm: the junction's width(s) and its layer's depth.
 * They replace the drawn (or fabricator-reported) values in the run's forecast.
 */
export const asBuilt = z
  .object({
    mainWidthUm: z.number().positive({ error: 'As-built width must be > 0 µm' }).max(100_000).optional(),
    inletWidthUm: z.number().positive({ error: 'As-built inlet width must be > 0 µm' }).max(100_000).optional(),
    depthUm: z.number().positive({ error: 'As-built depth must be > 0 µm' }).max(100_000).optional(),
  })
  .strict()

const sizes = z
  .array(z.number({ error: 'Each size must be a number' }).positive({ error: 'Each size must be > 0' }))
  .max(MAX_VALUES, { error: `A run holds at most ${MAX_VALUES} sizes; split the measurement into several runs` })

/** A CSV to import: which column, in which unit. Parsed by `parseSizeColumn` (shared/schemas/benchCsv.ts). */
export const csvImport = z
  .object({
    text: safeText(undefined, 'CSV').max(4_000_000, { error: 'A CSV is at most 4 MB of text; split it' }),
    /** A header name, or the 1-based column number as text or number. */
    column: z.union([
      shortText('Column', 200).min(1, 'Choose the column that holds the sizes'),
      z.number().int().positive(),
    ]),
    unit: z.enum(['um', 'mm', 'nm'], { error: 'Unit must be "um", "mm" or "nm"' }),
    header: z.boolean().default(true),
  })
  .strict()
export type CsvImport = z.input<typeof csvImport>

export const benchRunCreate = z
  .object({
    operatingPointId: elementId.optional(),
    junctionId: elementId.optional(),
    conditions: benchConditions.default({}),
    asBuilt: asBuilt.optional(),
    /** The chip the forecast is computed on: as built (the latest as-built report; the default when one exists) or as drawn. */
    chip: z.enum(['as-built', 'as-drawn'], { error: 'Chip must be "as-built" or "as-drawn"' }).optional(),
    quantity: z
      .enum(['diameter', 'plug-length'], { error: 'Quantity must be "diameter" or "plug-length"' })
      .default('diameter'),
    /** typed: `values` (with `unit`); csv: `csv`; micrograph: none yet (sizes come from the uploaded micrographs). */
    source: z.enum(['typed', 'csv', 'micrograph'], { error: 'Source must be "typed", "csv" or "micrograph"' }),
    values: sizes.optional(),
    unit: z.enum(['um', 'mm', 'nm'], { error: 'Unit must be "um", "mm" or "nm"' }).default('um'),
    csv: csvImport.optional(),
    frequencyHz: z
      .number()
      .positive({ error: 'Frequency must be > 0 Hz' })
      .max(1e6, { error: 'Frequency must be at most 1 MHz' })
      .optional(),
    ranAt: z.iso
      .datetime({ offset: true, error: 'When it ran must be an ISO date-time, e.g. 2026-11-30T14:00:00Z' })
      .optional(),
    notes: safeText(undefined, 'Notes').max(4000, 'Notes are at most 4000 characters').default(''),
  })
  .strict()
  .superRefine((run, ctx) => {
    if (run.source === 'typed' && !(run.values && run.values.length > 0))
      ctx.addIssue({ code: 'custom', path: ['values'], message: 'A typed run needs at least one measured size' })
    if (run.source === 'csv' && !run.csv)
      ctx.addIssue({ code: 'custom', path: ['csv'], message: 'A CSV run needs the CSV text, its column and unit' })
    if (run.source !== 'typed' && run.values)
      ctx.addIssue({ code: 'custom', path: ['values'], message: 'Sizes are typed only with source "typed"' })
    if (run.source !== 'csv' && run.csv)
      ctx.addIssue({ code: 'custom', path: ['csv'], message: 'A CSV is given only with source "csv"' })
    for (const [i, v] of (run.values ?? []).entries()) {
      if (v * SIZE_UNITS[run.unit] > MAX_SIZE_UM) {
        ctx.addIssue({
          code: 'custom',
          path: ['values', i],
          message: `Size ${i + 1} is above ${MAX_SIZE_UM / 1000} mm: check the unit`,
        })
        break
      }
    }
  })
export type BenchRunCreate = z.input<typeof benchRunCreate>

/** The scale of a micrograph: µm per pixel, or two points on a scale bar and the length between them. */
export const micrographScale = z.union(
  [
    z.object({
      umPerPx: z.coerce
        .number({ error: 'Scale must be a number of µm per pixel' })
        .positive({ error: 'Scale must be > 0 µm per pixel' })
        .max(1000, { error: 'Scale must be at most 1000 µm per pixel' }),
    }),
    z
      .object({
        barPx: z.coerce.number().positive({ error: 'The scale bar must be longer than 0 px' }),
        barUm: z.coerce.number().positive({ error: 'The scale bar length must be > 0 µm' }),
      })
      .transform(s => ({ umPerPx: s.barUm / s.barPx })),
  ],
  { error: 'Give the scale as umPerPx, or as barPx (the scale bar length in pixels) and barUm (its length in µm)' },
)

/** Two points on the scale bar (px) and the length between them (µm) → µm per pixel. */
export function scaleFromBar(a: { x: number; y: number }, b: { x: number; y: number }, lengthUm: number): number {
  const px = Math.hypot(b.x - a.x, b.y - a.y)
  if (!(px > 0) || !(lengthUm > 0))
    throw new RangeError('Pick two different points on the scale bar and give its length in µm')
  return lengthUm / px
}

export const micrographUpdate = z
  .object({
    /** Ids of detected drops the user marks as false detections (the rest count). */
    excluded: z.array(z.number().int().positive()).max(MAX_VALUES),
  })
  .strict()

export const forecastModeBody = z
  .object({
    designId: z.uuid('Design id must be a UUID'),
    mode: z.enum(['model', 'lab-calibrated'], { error: 'Mode must be "model" or "lab-calibrated"' }),
  })
  .strict()

export const calibrationQuery = z.object({ designId: z.uuid('Design id must be a UUID').optional() })

/** Micrograph uploads: what the server accepts (checked on the bytes, not the name). */
export const MICROGRAPH_TYPES = ['image/png', 'image/jpeg', 'image/tiff'] as const
export const MAX_MICROGRAPH_BYTES = 25 * 1024 * 1024
/** Decoded size limit: 64 megapixels (8192 × 8192), about 64 MB of grey pixels in the worker. */
export const MAX_MICROGRAPH_PIXELS = 64 * 1024 * 1024

/** A text/csv body's options, in the query: `?column=diameter&unit=um&header=true&operatingPointId=op1`. */
export const benchRunCsvQuery = z.object({
  column: z.string().min(1, 'Name the column that holds the sizes (?column=...)').max(200),
  unit: z.enum(['um', 'mm', 'nm'], { error: 'Unit must be "um", "mm" or "nm" (?unit=um)' }),
  header: z
    .enum(['true', 'false'])
    .default('true')
    .transform(v => v === 'true'),
  operatingPointId: elementId.optional(),
  junctionId: elementId.optional(),
  quantity: z.enum(['diameter', 'plug-length']).optional(),
  notes: safeText(undefined, 'Notes').max(4000).optional(),
})

export const micrographFileQuery = z.object({
  variant: z
    .enum(['original', 'thumbnail', 'view'], { error: 'Variant must be "original", "thumbnail" or "view"' })
    .default('view'),
})
