// Lab units at the edge: a number (already SI) or a string with a unit parsed by mathjs
// ("100 um", "5 uL/min", "2.5 mN/m", "20 degC", "3 mPa*s", "800 kg/m^3", "150 deg"), converted once to SI.
import { unit as mathUnit, type Unit } from 'mathjs'
import { z } from 'zod'

export type Dimension =
  | 'length'
  | 'volumeFlow'
  | 'pressure'
  | 'viscosity'
  | 'density'
  | 'surfaceTension'
  | 'temperature'
  | 'angle'

interface DimensionInfo {
  si: string
  label: string
  example: string
}

export const DIMENSIONS: Record<Dimension, DimensionInfo> = {
  length: { si: 'm', label: 'a length', example: '100 um' },
  volumeFlow: { si: 'm^3/s', label: 'a volume flow rate', example: '5 uL/min' },
  pressure: { si: 'Pa', label: 'a pressure', example: '200 mbar' },
  viscosity: { si: 'Pa s', label: 'a dynamic viscosity', example: '3 mPa*s' },
  density: { si: 'kg/m^3', label: 'a density', example: '800 kg/m^3' },
  surfaceTension: { si: 'N/m', label: 'a surface or interfacial tension', example: '5 mN/m' },
  temperature: { si: 'K', label: 'a temperature', example: '20 degC' },
  angle: { si: 'rad', label: 'an angle', example: '150 deg' },
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
      : { ok: false, message: `expected ${info.label} as a finite number in ${info.si} or a string such as "${info.example}" (got ${input})` }
  }
  if (typeof input !== 'string') {
    return { ok: false, message: `expected ${info.label}: a number in ${info.si} or a string such as "${info.example}"` }
  }
  const key = `${dimension}|${input}`
  const cached = parsedCache.get(key)
  if (cached) return cached
  const result = parseString(input, dimension, info)
  if (parsedCache.size >= CACHE_LIMIT) parsedCache.clear()
  parsedCache.set(key, result)
  return result
}

function parseString(input: string, dimension: Dimension, info: DimensionInfo): ParseResult {
  const text = input.trim()
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
  /** Strictly greater than zero (default true, except temperature and angle which check their own range). */
  positive?: boolean
  /** Inclusive SI bounds, with the message unit used to report them. */
  min?: number
  max?: number
}

/** Zod field for a quantity: accepts number (SI) or unit string, outputs the SI number. */
export function quantityField(dimension: Dimension, options: QuantityOptions = {}) {
  const positive = options.positive ?? (dimension !== 'temperature' && dimension !== 'angle')
  const info = DIMENSIONS[dimension]
  return z.union([z.number(), z.string()]).transform((input, ctx) => {
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
