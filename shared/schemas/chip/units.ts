import { z } from 'zod'
import { CHIP_LIMITS, shownLimit } from './limits'

// Units of the chip document. Every length is a plain number in micrometres (the document says so once, in
// `units: 'um'`); other quantities carry their unit in the field name (`temperatureC`, `pressureMbar`) or in
// a `unit` field. Inside the geometry core lengths are branded so they cannot be mixed with screen pixels.
// Every number is bounded (./limits.ts), and each message says the limit.
export type Micrometres = number & { readonly __unit: 'µm' }
export type Degrees = number & { readonly __unit: 'deg' }

export const um = (value: number): Micrometres => value as Micrometres

const L = CHIP_LIMITS

/** A finite coordinate in µm within ±200 000 µm (NaN and ±Infinity are rejected with the field's name). */
export const coordinateUm = (label: string) =>
  z
    .number({ error: `${label} must be a finite number in µm` })
    .min(-L.coordinateUm, { error: `${label} must be at least −${shownLimit(L.coordinateUm)} µm` })
    .max(L.coordinateUm, { error: `${label} must be at most ${shownLimit(L.coordinateUm)} µm` })

/** A length in µm that must be strictly positive: from 0.01 µm up to `max` (400 000 µm unless given). */
export const positiveUm = (label: string, max: number = L.lengthUm) =>
  z
    .number({ error: `${label} must be a finite number in µm` })
    .positive({ error: `${label} must be > 0 µm`, abort: true })
    .min(L.minLengthUm, { error: `${label} must be at least ${L.minLengthUm} µm` })
    .max(max, { error: `${label} must be at most ${shownLimit(max)} µm` })

/** A length in µm that may be zero, up to 400 000 µm. */
export const nonNegativeUm = (label: string) =>
  z
    .number({ error: `${label} must be a finite number in µm` })
    .nonnegative({ error: `${label} must be ≥ 0 µm`, abort: true })
    .max(L.lengthUm, { error: `${label} must be at most ${shownLimit(L.lengthUm)} µm` })

/** An angle in degrees, counter-clockwise, within one turn either way. */
export const degrees = (label: string) =>
  z
    .number({ error: `${label} must be a finite number in degrees` })
    .min(-L.rotationDeg, { error: `${label} must be between −${L.rotationDeg}° and ${L.rotationDeg}°` })
    .max(L.rotationDeg, { error: `${label} must be between −${L.rotationDeg}° and ${L.rotationDeg}°` })

/** A whole count from `min` to `max`. */
export const countOf = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a whole number` })
    .int({ error: `${label} must be a whole number` })
    .min(min, { error: `${label} must be at least ${min}` })
    .max(max, { error: `${label} must be at most ${shownLimit(max)}` })
