// Lab units at the edge: a number (already SI) or a string with a unit parsed by mathjs
// ("100 um", "5 uL/min", "2.5 mN/m", "20 degC", "3 mPa*s", "800 kg/m^3", "150 deg"), converted once to SI.
import { unit as mathUnit, type Unit } from 'mathjs'
import { z } from 'zod'
import { textProblem } from './text'

export type Dimension =
  'length' | 'volumeFlow' | 'pressure' | 'viscosity' | 'density' | 'surfaceTension' | 'temperature' | 'angle'

interface DimensionInfo {
  si: string
  label: string
  example: string
  /**
   * Largest magnitude accepted (SI), and the smallest for quantities that must be > 0: wide enough for any lab,
   * narrow enough that no formula of the forecast overflows a double (tests/unit/schemas/forecast-bounds.test.ts
   * runs every extreme). Common practice, no source, unless said.
   */
  max: number
  min: number
  /** The limits as a lab writes them. */
  shown: { min: string; max: string }
}

export const DIMENSIONS: Record<Dimension, DimensionInfo> = {
  // 10 nm (below any mask) to 10 m (a long tubing run)
  length: { si: 'm', label: 'a length', example: '100 um', min: 1e-8, max: 10, shown: { min: '10 nm', max: '10 m' } },
  // 1 fL/s to 1 L/s
  volumeFlow: {
    si: 'm^3/s',
    label: 'a volume flow rate',
    example: '5 uL/min',
    min: 1e-18,
    max: 1e-3,
    shown: { min: '1 fL/s', max: '1 L/s' },
  },
  // up to 1 kbar, far beyond any chip or pump
  pressure: {
    si: 'Pa',
    label: 'a pressure',
    example: '200 mbar',
    min: 1e-3,
    max: 1e8,
    shown: { min: '0.001 Pa', max: '1000 bar' },
  },
  // a gas (air ≈ 1.8e-5 Pa·s) to a paste
  viscosity: {
    si: 'Pa s',
    label: 'a dynamic viscosity',
    example: '3 mPa*s',
    min: 1e-6,
    max: 1e4,
    shown: { min: '0.001 mPa*s', max: '10000 Pa*s' },
  },
  // a gas to beyond osmium (22 590 kg/m³)
  density: {
    si: 'kg/m^3',
    label: 'a density',
    example: '800 kg/m^3',
    min: 0.01,
    max: 3e4,
    shown: { min: '0.01 kg/m^3', max: '30000 kg/m^3' },
  },
  // ultra-low microemulsion tensions to beyond mercury (≈ 0.485 N/m)
  surfaceTension: {
    si: 'N/m',
    label: 'a surface or interfacial tension',
    example: '5 mN/m',
    min: 1e-6,
    max: 1,
    shown: { min: '0.001 mN/m', max: '1000 mN/m' },
  },
  // −100 °C to 300 °C
  temperature: {
    si: 'K',
    label: 'a temperature',
    example: '20 degC',
    min: 173.15,
    max: 573.15,
    shown: { min: '-100 degC', max: '300 degC' },
  },
  angle: {
    si: 'rad',
    label: 'an angle',
    example: '150 deg',
    min: 0,
    max: 2 * Math.PI,
    shown: { min: '0 deg', max: '360 deg' },
  },
}

const reference = new Map<Dimension, Unit>()
function referenceUnit(dimension: Dimension): Unit {
  let found = reference.get(dimension)
  if (!found) {
    found = mathUnit(DIMENSIONS[dimension].si)
    reference.set(dimension, found)
  }
  return found
}

export type ParseResult = { ok: true; value: number } | { ok: false; message: string }

/** Parsed strings per dimension: a chip repeats the same few sizes thousands of times. Bounded to stay small. */
const parsedCache = new Map<string, ParseResult>()
const CACHE_LIMIT = 4096

/** Parses a number (taken as SI) or a unit string into the SI value of `dimension`. */
export function parseQuantity(input: unknown, dimension: Dimension): ParseResult {
  const info = DIMENSIONS[dimension]
  if (typeof input === 'number') {
    return Number.isFinite(input)
      ? { ok: true, value: input }
      : {
          ok: false,
          message: `expected ${info.label} as a finite number in ${info.si} or a string such as "${info.example}" (got ${input})`,
        }
  }
  if (typeof input !== 'string') {
    return {
      ok: false,
      message: `expected ${info.label}: a number in ${info.si} or a string such as "${info.example}"`,
    }
  }
  const key = `${dimension}|${input}`
  const cached = parsedCache.get(key)
  if (cached) return cached
  const result = parseString(input, dimension, info)
  if (parsedCache.size >= CACHE_LIMIT) parsedCache.clear()
  parsedCache.set(key, result)
  return result
}

/**
 * Lab spellings mathjs does not know, rewritten before parsing: the micro sign (µ U+00B5, μ U+03BC) as "u",
 * centipoise and poise (1 cP = 1 mPa·s, 1 P = 0.1 Pa·s; BIPM SI Brochure, 9th ed., table 8 non-SI units), "°C"/"°".
 */
export function normalizeUnitText(text: string): string {
  return text
    .replace(/[\u00b5\u03bc](?=[a-zA-Z])/g, 'u')
    .replace(/°\s*C\b/g, 'degC')
    .replace(/°/g, 'deg')
    .replace(/(^|[\d\s.)])cP\b/g, '$1mPa*s')
    .replace(/(^|[\d\s.)])P\b(?!a)/g, '$1dPa*s')
}

function parseString(input: string, dimension: Dimension, info: DimensionInfo): ParseResult {
  const text = normalizeUnitText(input.trim())
  if (/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(text)) {
    return { ok: false, message: `"${input}" has no unit; write it with one, e.g. "${info.example}"` }
  }
  let parsed: Unit
  try {
    parsed = mathUnit(text)
  } catch {
    return { ok: false, message: `"${input}" is not a quantity; write ${info.label} such as "${info.example}"` }
  }
  if (!parsed.equalBase(referenceUnit(dimension))) {
    return { ok: false, message: `"${input}" is not ${info.label}; use a unit such as "${info.example}"` }
  }
  const value = parsed.toNumber(info.si)
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, message: `"${input}" is not a finite value` }
}

export interface QuantityOptions {
  /**
   * Strictly greater than zero and at least the dimension's smallest value (default true, except temperature
   * and angle which check their own range). Either way the magnitude is at most the dimension's largest.
   */
  positive?: boolean
  /** Inclusive SI bounds, with the message unit used to report them. */
  min?: number
  max?: number
}

/** Zod field for a quantity: accepts number (SI) or unit string, outputs the SI number. */
export function quantityField(dimension: Dimension, options: QuantityOptions = {}) {
  const positive = options.positive ?? (dimension !== 'temperature' && dimension !== 'angle')
  const info = DIMENSIONS[dimension]
  return z
    .union([z.number(), z.string().max(100, 'a quantity is at most 100 characters, e.g. "100 um"')])
    .transform((input, ctx) => {
      const broken = typeof input === 'string' ? textProblem(input) : null
      if (broken) {
        ctx.addIssue({ code: 'custom', message: `a quantity ${broken}` })
        return z.NEVER
      }
      const result = parseQuantity(input, dimension)
      if (!result.ok) {
        ctx.addIssue({ code: 'custom', message: result.message })
        return z.NEVER
      }
      const shown = typeof input === 'string' ? `"${input}"` : `${input} ${info.si}`
      if (positive && !(result.value > 0)) {
        ctx.addIssue({ code: 'custom', message: `must be > 0 (got ${shown})` })
        return z.NEVER
      }
      if (Math.abs(result.value) > info.max) {
        ctx.addIssue({
          code: 'custom',
          message: `must be at most ${info.shown.max} (${info.max} ${info.si}; got ${shown})`,
        })
        return z.NEVER
      }
      if (positive && result.value < info.min) {
        ctx.addIssue({
          code: 'custom',
          message: `must be at least ${info.shown.min} (${info.min} ${info.si}; got ${shown})`,
        })
        return z.NEVER
      }
      if (options.min !== undefined && result.value < options.min) {
        ctx.addIssue({ code: 'custom', message: `must be at least ${options.min} ${info.si} (got ${shown})` })
        return z.NEVER
      }
      if (options.max !== undefined && result.value > options.max) {
        ctx.addIssue({ code: 'custom', message: `must be at most ${options.max} ${info.si} (got ${shown})` })
        return z.NEVER
      }
      return result.value
    })
}
