// The planner request (POST /api/v1/plan and `npm run plan`): a forecast request without "flow" (a single
// junction, or a chip document and one of its junctions) plus the target droplet, the search box and the
// optional encapsulation, digital-assay and run questions. Parsed output is SI throughout.
import { unit as mathUnit } from 'mathjs'
import { z } from 'zod'
import { BUILT_IN_PROCESSES, LAB_PROCESS_ID } from '../../geometry/rules/processes'
import { junctionRequest } from './forecast'
import { quantityField } from './quantity'
import { safeText, textProblem } from './text'

/** Bounds of a plan request (common practice, no source): a scan costs one forecast per point. */
export const PLAN_LIMITS = {
  pointsPerAxis: { min: 3, max: 100, junction: 25, document: 21, pressure: 8, chip: 40 },
  /** A chip's grid: points² × channels at most this (about 10 s of forecasts on a busy 2-core machine). */
  chipWork: 100_000,
  /** Partitions of a digital assay and droplets of a run. */
  count: 1e12,
  minutes: 1e5,
} as const

/** Quantities the forecast's unit parser does not cover, parsed the same way (mathjs units, SI out). */
const EXTRA = {
  volume: { si: 'm^3', example: '33 pL', min: 1e-21, max: 1e-6, shown: '1 zL to 1 mL' },
  frequency: { si: 'Hz', example: '500 Hz', min: 1e-6, max: 1e7, shown: '1 µHz to 10 MHz' },
  concentration: { si: 'm^-3', example: '2e6 /mL', min: 1, max: 1e24, shown: '1e-6 /mL to 1e18 /mL' },
} as const
type Extra = keyof typeof EXTRA

/** "2e6 /mL" → mathjs "2e6 mL^-1" (a bare leading "/" is how labs write a concentration). */
function normalise(text: string): string {
  const per = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*\/\s*([A-Za-zµ]+)$/i.exec(text.trim())
  return per ? `${per[1]} ${per[2]}^-1` : text.trim().replace(/µ/g, 'u')
}

/** Zod field for a volume, a frequency or a number concentration: a number (SI) or a string with its unit. */
export function extraQuantity(kind: Extra) {
  const info = EXTRA[kind]
  return z.union([z.number(), z.string().max(100, 'a quantity is at most 100 characters')]).transform((input, ctx) => {
    const fail = (message: string) => {
      ctx.addIssue({ code: 'custom', message })
      return z.NEVER
    }
    let value: number
    if (typeof input === 'number') value = input
    else {
      const broken = textProblem(input)
      if (broken) return fail(`a quantity ${broken}`)
      if (/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(input.trim()))
        return fail(`"${input}" has no unit; write it with one, e.g. "${info.example}"`)
      try {
        const parsed = mathUnit(normalise(input))
        if (!parsed.equalBase(mathUnit(`1 ${info.si}`)))
          return fail(`"${input}" is not a ${kind}; use a unit such as "${info.example}"`)
        value = parsed.toNumber(info.si)
      } catch {
        return fail(`"${input}" is not a quantity; write a ${kind} such as "${info.example}"`)
      }
    }
    if (!Number.isFinite(value) || value < info.min || value > info.max)
      return fail(`must be between ${info.shown} (got ${JSON.stringify(input)})`)
    return value
  })
}

const range = (what: 'volumeFlow' | 'pressure', name: string) =>
  z
    .tuple([quantityField(what), quantityField(what)])
    .refine(([a, b]) => a < b, `${name}: give [low, high] with low < high`)

const count = (what: string, min = 1) =>
  z
    .number()
    .int(`${what} is a whole number`)
    .min(min, `${what} must be at least ${min}`)
    .max(PLAN_LIMITS.count, `${what} is at most ${PLAN_LIMITS.count}`)

export const planTarget = z
  .strictObject({
    dropletDiameter: quantityField('length').optional(),
    dropletVolume: extraQuantity('volume').optional(),
    /** Relative tolerance on the diameter, e.g. 0.05 for ± 5 %. */
    tolerance: z
      .number()
      .gt(0, 'tolerance is a fraction > 0, e.g. 0.05 for ± 5 %')
      .max(0.5, 'tolerance is at most 0.5 (± 50 %)')
      .default(0.05),
    minFrequency: extraQuantity('frequency').optional(),
  })
  .refine(
    t => (t.dropletDiameter === undefined) !== (t.dropletVolume === undefined),
    'give exactly one of "dropletDiameter" (e.g. "40 um") or "dropletVolume" (e.g. "33 pL")',
  )

export const planSearch = z.strictObject({
  continuous: range('volumeFlow', 'search.continuous').optional(),
  dispersed: range('volumeFlow', 'search.dispersed').optional(),
  continuousPressure: range('pressure', 'search.continuousPressure').optional(),
  dispersedPressure: range('pressure', 'search.dispersedPressure').optional(),
  /** Grid points along each axis. */
  points: z
    .number()
    .int('search.points is a whole number')
    .min(PLAN_LIMITS.pointsPerAxis.min, `search.points must be at least ${PLAN_LIMITS.pointsPerAxis.min}`)
    .max(
      PLAN_LIMITS.pointsPerAxis.max,
      `search.points is at most ${PLAN_LIMITS.pointsPerAxis.max} (a ${PLAN_LIMITS.pointsPerAxis.max} × ${PLAN_LIMITS.pointsPerAxis.max} grid)`,
    )
    .optional(),
})

export const planEncapsulation = z.strictObject({
  concentration: extraQuantity('concentration'),
  /** Mean cells (or beads) per droplet wanted; default 0.1 (about one loaded drop in ten). */
  targetLambda: z
    .number()
    .gt(0, 'targetLambda must be > 0, e.g. 0.1')
    .max(100, 'targetLambda is at most 100')
    .optional(),
})

export const planDigital = z
  .strictObject({
    partitions: count('digital.partitions'),
    positives: z.number().int('digital.positives is a whole number').min(0, 'digital.positives must be ≥ 0').optional(),
    confidence: z
      .number()
      .gt(0.5, 'digital.confidence is a fraction such as 0.95')
      .lt(1, 'digital.confidence must be < 1')
      .optional(),
  })
  .refine(d => d.positives === undefined || d.positives <= d.partitions, {
    message: 'digital.positives cannot exceed digital.partitions',
    path: ['positives'],
  })

export const planRun = z
  .strictObject({
    droplets: count('run.droplets').optional(),
    minutes: z
      .number()
      .gt(0, 'run.minutes must be > 0')
      .max(PLAN_LIMITS.minutes, `run.minutes is at most ${PLAN_LIMITS.minutes}`)
      .optional(),
  })
  .refine(
    r => (r.droplets === undefined) !== (r.minutes === undefined),
    'give exactly one of "droplets" (a count) or "minutes"',
  )

/** A built-in process or a lab's own ("lab-…"); which lab processes exist is the planner's to check (it is given them). */
const processId = safeText()
  .max(64)
  .refine(id => BUILT_IN_PROCESSES.some(p => p.id === id) || LAB_PROCESS_ID.test(id), {
    message: `use one of the fabrication processes ${BUILT_IN_PROCESSES.map(p => `"${p.id}"`).join(', ')} or one of your lab's ("lab-…")`,
  })

const planQuestions = {
  target: planTarget,
  search: planSearch.optional(),
  limits: z
    .strictObject({
      bondPressure: quantityField('pressure').optional(),
      pumpPressure: quantityField('pressure').optional(),
    })
    .optional(),
  process: processId.optional(),
  encapsulation: planEncapsulation.optional(),
  digital: planDigital.optional(),
  run: planRun.optional(),
}

/** A single junction: the forecast's junction request without "flow". */
export const planJunctionRequest = junctionRequest.omit({ flow: true }).extend(planQuestions)
export type PlanJunctionRequest = z.output<typeof planJunctionRequest>

/** A chip document and the junction to plan (default its first); the operating point to start from (default the active one). */
export const planDocumentRequest = z.strictObject({
  document: z.unknown(),
  operatingPoint: safeText()
    .min(1, 'name an operating point id or leave "operatingPoint" out for the active one')
    .max(64)
    .optional(),
  junctionId: safeText().min(1, 'name a junction id of the document, e.g. "tj-1"').max(96).optional(),
  ...planQuestions,
})
export type PlanDocumentRequest = z.output<typeof planDocumentRequest>
