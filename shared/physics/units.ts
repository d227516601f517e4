// Branded SI quantities for the forecast core. Conversions from lab units happen once, at the edge
// (shared/schemas/quantity.ts); inside shared/physics every number is SI and its type says which.
declare const unitBrand: unique symbol
export type Si<Name extends string> = number & { readonly [unitBrand]: Name }

export type Metres = Si<'m'>
export type SquareMetres = Si<'m^2'>
export type CubicMetres = Si<'m^3'>
export type Seconds = Si<'s'>
export type Hertz = Si<'Hz'>
export type MetresPerSecond = Si<'m/s'>
export type CubicMetresPerSecond = Si<'m^3/s'>
export type Pascals = Si<'Pa'>
export type PascalSeconds = Si<'Pa*s'>
export type NewtonsPerMetre = Si<'N/m'>
export type KilogramsPerCubicMetre = Si<'kg/m^3'>
export type Kelvin = Si<'K'>
export type Radians = Si<'rad'>
export type Joules = Si<'J'>
/** Hydraulic resistance, pressure drop per volume flow. */
export type HydraulicResistance = Si<'Pa*s/m^3'>
export type Dimensionless = Si<'1'>

/** Unit strings used in answers, one per branded type. */
export const UNIT = {
  length: 'm',
  area: 'm^2',
  volume: 'm^3',
  time: 's',
  frequency: 'Hz',
  speed: 'm/s',
  flow: 'm^3/s',
  pressure: 'Pa',
  viscosity: 'Pa*s',
  tension: 'N/m',
  density: 'kg/m^3',
  temperature: 'K',
  angle: 'rad',
  energy: 'J',
  resistance: 'Pa*s/m^3',
  none: '1',
} as const

export const STANDARD_GRAVITY = 9.80665 as number // m/s^2, CGPM 1901 conventional value
export const ZERO_CELSIUS = 273.15 as Kelvin

export const asSi = <T extends Si<string>>(value: number): T => value as T
export const celsius = (kelvin: Kelvin): number => kelvin - ZERO_CELSIUS
