// A lab's own liquids and liquid pairs, as plain data, merged with the built-in library into one object that the
// forecast takes as a parameter (the core never fetches: the server or the browser loads the lab's entries).
import { quantity, type Method, type Warning } from '../quantity'
import { UNIT, type Kelvin, type NewtonsPerMetre } from '../units'
import { LIQUIDS, type LibraryLiquid } from './library'
import { OIL_TEMPERATURE_WINDOW } from './oils'
import { PAIRS, SURFACTANTS, type LiquidPair } from './pairs'

/** One measured row of a lab liquid: temperature in °C, viscosity in mPa·s, density in kg/m³, tension in mN/m. */
export interface LabLiquidRow {
  temperatureC: number
  viscosityMPaS: number
  densityKgPerM3: number
  surfaceTensionMNPerM?: number
}

/** A lab's liquid. One row: a single-point value, valid ±10 K like the built-in oils; several: a temperature table. */
export interface LabLiquidData {
  /** Always starts with "lab-" so it can never shadow a built-in id. */
  id: string
  name: string
  source: string
  table: LabLiquidRow[]
}

export interface LabPairData {
  /** Liquid ids (built-in or the lab's); lookup is order-free. */
  liquids: [string, string]
  surfactant: string
  interfacialTensionMNPerM: number
  source: string
}

export interface LabLiquidsData {
  liquids: LabLiquidData[]
  pairs: LabPairData[]
}

/** Everything the forecast looks liquids and pairs up in: built-in entries and, when a lab is given, the lab's. */
export interface LiquidLibrary {
  liquids: readonly LibraryLiquid[]
  pairs: readonly LiquidPair[]
  surfactants: readonly string[]
}

export const BUILT_IN_LIBRARY: LiquidLibrary = { liquids: LIQUIDS, pairs: PAIRS, surfactants: SURFACTANTS }

const ZERO_C = 273.15

// Between rows, ln μ is interpolated linearly in 1/T (the Andrade form ln μ = A + B/T: E. N. da C. Andrade 1930,
// Nature 125, 309, from memory); density and tension linearly in T (common practice, no source).
function between(rows: readonly LabLiquidRow[], kelvin: number): { row: LabLiquidRow; hasTension: boolean } {
  const t = kelvin - ZERO_C
  const hasTension = rows.every(r => r.surfaceTensionMNPerM !== undefined)
  if (rows.length === 1 || t <= rows[0]!.temperatureC) return { row: rows[0]!, hasTension }
  const last = rows[rows.length - 1]!
  if (t >= last.temperatureC) return { row: last, hasTension }
  let i = 0
  while (rows[i + 1]!.temperatureC < t) i++
  const a = rows[i]!
  const b = rows[i + 1]!
  const invA = 1 / (a.temperatureC + ZERO_C)
  const invB = 1 / (b.temperatureC + ZERO_C)
  const s = (1 / kelvin - invA) / (invB - invA)
  const f = (t - a.temperatureC) / (b.temperatureC - a.temperatureC)
  const lin = (x: number, y: number) => x + (y - x) * f
  const row: LabLiquidRow = {
    temperatureC: t,
    viscosityMPaS: Math.exp(Math.log(a.viscosityMPaS) + (Math.log(b.viscosityMPaS) - Math.log(a.viscosityMPaS)) * s),
    densityKgPerM3: lin(a.densityKgPerM3, b.densityKgPerM3),
  }
  if (hasTension) row.surfaceTensionMNPerM = lin(a.surfaceTensionMNPerM!, b.surfaceTensionMNPerM!)
  return { row, hasTension }
}

/** The valid range of a lab liquid: its table's span, or ±10 K around a single row (as the built-in oils). */
export function labLiquidRange(data: LabLiquidData): { min: number; max: number } {
  const temps = data.table.map(r => r.temperatureC + ZERO_C)
  const lo = Math.min(...temps)
  const hi = Math.max(...temps)
  return temps.length === 1
    ? { min: lo - OIL_TEMPERATURE_WINDOW, max: hi + OIL_TEMPERATURE_WINDOW }
    : { min: lo, max: hi }
}

/** A lab liquid as a library entry (marked as the lab's). */
export function labLiquid(data: LabLiquidData): LibraryLiquid {
  const rows = [...data.table].sort((a, b) => a.temperatureC - b.temperatureC)
  const range = labLiquidRange(data)
  const method: Method = { id: `lab-${data.id}`, source: `${data.name}: ${data.source} (the lab's library)` }
  return {
    id: data.id,
    name: data.name,
    origin: 'lab',
    parameters: [],
    temperatureRange: range,
    sources: [method.source],
    properties(temperature: Kelvin) {
      const ok = temperature >= range.min && temperature <= range.max
      const { row, hasTension } = between(rows, temperature)
      const warnings: Warning[] = ok
        ? []
        : [
            {
              code: 'liquid-temperature-out-of-range',
              message: `${data.id}: ${(temperature - ZERO_C).toFixed(1)} °C is outside the lab's table ${(range.min - ZERO_C).toFixed(1)}–${(range.max - ZERO_C).toFixed(1)} °C; the nearest row stands in, marked invalid`,
            },
          ]
      return {
        liquid: {
          id: data.id,
          name: data.name,
          viscosity: quantity(row.viscosityMPaS * 1e-3, UNIT.viscosity, method, ok),
          density: quantity(row.densityKgPerM3, UNIT.density, method, ok),
          ...(hasTension
            ? { surfaceTension: quantity(row.surfaceTensionMNPerM! * 1e-3, UNIT.tension, method, ok) }
            : {}),
        },
        warnings,
      }
    },
  }
}

export function labPair(data: LabPairData): LiquidPair {
  return {
    liquids: [data.liquids[0], data.liquids[1]],
    surfactant: data.surfactant,
    interfacialTension: (data.interfacialTensionMNPerM * 1e-3) as NewtonsPerMetre,
    source: `${data.liquids[0]}/${data.liquids[1]} with "${data.surfactant}": ${data.source} (the lab's library)`,
    origin: 'lab',
  }
}

/** Built-in entries plus the lab's; a lab pair comes first, so it wins over a built-in pair of the same liquids. */
export function mergeLibrary(lab?: LabLiquidsData | null): LiquidLibrary {
  if (!lab || (lab.liquids.length === 0 && lab.pairs.length === 0)) return BUILT_IN_LIBRARY
  const pairs = [...lab.pairs.map(labPair), ...PAIRS]
  const surfactants = [...new Set([...SURFACTANTS, ...lab.pairs.map(p => p.surfactant)])]
  return { liquids: [...LIQUIDS, ...lab.liquids.map(labLiquid)], pairs, surfactants }
}
