// Resolves the liquids and the interfacial tension of a request into properties with their sources.
import { ForecastInputError } from '../errors'
import { BUILT_IN_LIBRARY, findLiquid, findPair, type LiquidLibrary, type LiquidProperties } from '../liquids'
import { INPUT, quantity, type Quantity, type Warning } from '../quantity'
import { UNIT, type Kelvin } from '../units'

export type LiquidSpec =
  | { liquid: string; massFraction?: number }
  | { name?: string; viscosity: number; density: number; surfaceTension?: number }

export function resolveLiquid(
  spec: LiquidSpec,
  temperature: Kelvin,
  path: string,
  library: LiquidLibrary = BUILT_IN_LIBRARY,
): { liquid: LiquidProperties; warnings: Warning[] } {
  if ('liquid' in spec) {
    const entry = findLiquid(spec.liquid, library.liquids)
    if (!entry) {
      const known = library.liquids.map(liquid => `"${liquid.id}"`).join(', ')
      throw new ForecastInputError([
        {
          path: `${path}.liquid`,
          message: `unknown liquid "${spec.liquid}"; use one of ${known} or give viscosity and density explicitly`,
        },
      ])
    }
    const needsFraction = entry.parameters.includes('massFraction')
    if (needsFraction && spec.massFraction === undefined) {
      throw new ForecastInputError([
        {
          path: `${path}.massFraction`,
          message: `"${entry.id}" needs "massFraction", the glycerol mass fraction between 0 and 1 (e.g. 0.5)`,
        },
      ])
    }
    if (!needsFraction && spec.massFraction !== undefined) {
      throw new ForecastInputError([
        { path: `${path}.massFraction`, message: `"${entry.id}" takes no massFraction; remove it` },
      ])
    }
    return entry.properties(temperature, spec.massFraction)
  }
  const liquid: LiquidProperties = {
    name: spec.name ?? 'liquid given by its properties',
    viscosity: quantity(spec.viscosity, UNIT.viscosity, INPUT),
    density: quantity(spec.density, UNIT.density, INPUT),
  }
  if (spec.surfaceTension !== undefined) liquid.surfaceTension = quantity(spec.surfaceTension, UNIT.tension, INPUT)
  return { liquid, warnings: [] }
}

/** The given tension, else the library pair's, else an error saying how to provide it. */
/** The built-in pairs' temperature, K: they are room-temperature figures (liquids/pairs.ts), 20–25 °C. */
const PAIR_TEMPERATURE = { min: 293.15, max: 298.15 }
/** How far from it a library tension goes without a note: the oils' own window, 10 K (liquids/oils.ts). */
const PAIR_TEMPERATURE_WINDOW = 10

/**
 * The note a tension taken from the built-in pairs gets at a temperature far from theirs: tension falls as the
 * temperature rises, by about 0.1 mN/m per K for water against an alkane without surfactant (from memory; with
 * surfactant it depends on the surfactant and its concentration), and none of the pairs has a temperature law.
 */
export function tensionTemperatureWarnings(tension: Quantity, temperature: Kelvin): Warning[] {
  if (tension.method !== 'library-pair') return []
  const { min, max } = PAIR_TEMPERATURE
  if (temperature >= min - PAIR_TEMPERATURE_WINDOW && temperature <= max + PAIR_TEMPERATURE_WINDOW) return []
  const c = (k: number) => (k - 273.15).toFixed(1)
  return [
    {
      code: 'tension-temperature',
      message:
        `The interfacial tension ${(tension.value * 1e3).toPrecision(3)} mN/m is the library's room-temperature value (${c(min)}–${c(max)} °C); ` +
        `at ${c(temperature)} °C it is ${temperature > max ? 'lower' : 'higher'}, by about 0.1 mN/m per K for water against an alkane without surfactant ` +
        '(from memory) and by an amount that depends on the surfactant otherwise: measure it at your temperature and give it as the interfacial tension',
    },
  ]
}

export function resolveTension(
  given: number | undefined,
  continuous: LiquidProperties,
  dispersed: LiquidProperties,
  surfactant: string,
  library: LiquidLibrary = BUILT_IN_LIBRARY,
): Quantity {
  if (given !== undefined) return quantity(given, UNIT.tension, INPUT)
  const pair =
    continuous.id && dispersed.id ? findPair(continuous.id, dispersed.id, surfactant, library.pairs) : undefined
  if (pair)
    return quantity(pair.interfacialTension, UNIT.tension, {
      id: pair.origin === 'lab' ? 'lab-library-pair' : 'library-pair',
      source: pair.source,
    })
  const known = library.pairs.map(p => `${p.liquids[0]}/${p.liquids[1]} (${p.surfactant})`).join(', ')
  throw new ForecastInputError([
    {
      path: 'interfacialTension',
      message: `required: the pair ${dispersed.id ?? dispersed.name}/${continuous.id ?? continuous.name} with surfactant "${surfactant}" is not in the library; give it (e.g. "5 mN/m") or use a library pair: ${known}`,
    },
  ])
}
