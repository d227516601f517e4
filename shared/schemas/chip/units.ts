import { z } from 'zod'

// Units of the chip document. Every length is a plain number in micrometres (the document says so once, in
// `units: 'um'`); other quantities carry their unit in the field name (`temperatureC`, `pressureMbar`) or in
// a `unit` field. Inside the geometry core lengths are branded so they cannot be mixed with screen pixels.
export type Micrometres = number & { readonly __unit: 'µm' }
export type Degrees = number & { readonly __unit: 'deg' }

export const um = (value: number): Micrometres => value as Micrometres

/** A finite coordinate in µm (NaN and ±Infinity are rejected with the field's name). */
export const coordinateUm = (label: string) =>
  z.number({ error: `${label} must be a finite number in µm` })

/** A length in µm that must be strictly positive. */
export const positiveUm = (label: string) =>
  z.number({ error: `${label} must be a finite number in µm` }).positive({ error: `${label} must be > 0 µm` })

/** A length in µm that may be zero. */
export const nonNegativeUm = (label: string) =>
  z.number({ error: `${label} must be a finite number in µm` }).nonnegative({ error: `${label} must be ≥ 0 µm` })

/** An angle in degrees, counter-clockwise. */
export const degrees = (label: string) => z.number({ error: `${label} must be a finite number in degrees` })
