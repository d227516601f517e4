// The built-in liquids library: each liquid by id, with a function of temperature (and mass fraction).
import { quantity, type Method, type Quantity, type Warning } from '../quantity'
import { UNIT, type Kelvin } from '../units'
import {
  CHENG_DENSITY,
  CHENG_VISCOSITY,
  chengRange,
  glycerolWaterDensity,
  glycerolWaterViscosity,
} from './glycerolWater'
import { OIL_TEMPERATURE_WINDOW, OILS, type TabulatedLiquid } from './oils'
import {
  IAPWS_SURFACE_TENSION,
  IAPWS_VISCOSITY,
  KELL_DENSITY,
  waterDensity,
  waterLiquidRange,
  waterSurfaceTension,
  waterViscosity,
} from './water'

export interface LiquidProperties {
  id?: string
  name: string
  viscosity: Quantity
  density: Quantity
  /** Against air; absent when the library has no value. */
  surfaceTension?: Quantity
}

export interface LibraryLiquid {
  id: string
  name: string
  /** 'lab' for an entry of the lab's own library; absent for a built-in one. */
  origin?: 'lab'
  /** Extra parameters the liquid needs besides temperature. */
  parameters: readonly 'massFraction'[]
  temperatureRange: { min: number; max: number }
  sources: readonly string[]
  properties(temperature: Kelvin, massFraction?: number): { liquid: LiquidProperties; warnings: Warning[] }
}

function rangeWarning(
  id: string,
  temperature: number,
  range: { min: number; max: number },
  clamped = false,
): Warning[] {
  if (temperature >= range.min && temperature <= range.max) return []
  const c = (k: number) => (k - 273.15).toFixed(1)
  const edge = clamped
    ? `; evaluated at ${c(Math.min(Math.max(temperature, range.min), range.max))} °C, the nearest edge, rather than extrapolated`
    : ''
  return [
    {
      code: 'liquid-temperature-out-of-range',
      message: `${id}: ${c(temperature)} °C is outside the correlation's range ${c(range.min)}–${c(range.max)} °C${edge}; its properties are marked invalid`,
    },
  ]
}

/**
 * Correlations are evaluated inside their range only: outside it they extrapolate to nonsense (IAPWS water
 * viscosity at −60 °C rounds to zero), so the nearest edge stands in, marked invalid with a warning.
 */
const clampTo = (temperature: Kelvin, range: { min: number; max: number }) =>
  Math.min(Math.max(temperature, range.min), range.max) as Kelvin

const water: LibraryLiquid = {
  id: 'water',
  name: 'water',
  parameters: [],
  temperatureRange: waterLiquidRange,
  sources: [IAPWS_VISCOSITY.source, KELL_DENSITY.source, IAPWS_SURFACE_TENSION.source],
  properties(given) {
    const ok = given >= waterLiquidRange.min && given <= waterLiquidRange.max
    const temperature = clampTo(given, waterLiquidRange)
    return {
      liquid: {
        id: 'water',
        name: 'water',
        viscosity: quantity(waterViscosity(temperature), UNIT.viscosity, IAPWS_VISCOSITY, ok),
        density: quantity(waterDensity(temperature), UNIT.density, KELL_DENSITY, ok),
        surfaceTension: quantity(waterSurfaceTension(temperature), UNIT.tension, IAPWS_SURFACE_TENSION, ok),
      },
      warnings: rangeWarning('water', given, waterLiquidRange, true),
    }
  },
}

const glycerolWater: LibraryLiquid = {
  id: 'glycerol-water',
  name: 'glycerol–water mixture',
  parameters: ['massFraction'],
  temperatureRange: chengRange,
  sources: [CHENG_VISCOSITY.source, CHENG_DENSITY.source],
  properties(given, massFraction = 0) {
    const ok = given >= chengRange.min && given <= chengRange.max
    const temperature = clampTo(given, chengRange)
    const percent = (massFraction * 100).toFixed(1)
    return {
      liquid: {
        id: 'glycerol-water',
        name: `glycerol–water, ${percent} wt% glycerol`,
        viscosity: quantity(glycerolWaterViscosity(temperature, massFraction), UNIT.viscosity, CHENG_VISCOSITY, ok),
        density: quantity(glycerolWaterDensity(temperature, massFraction), UNIT.density, CHENG_DENSITY, ok),
      },
      warnings: rangeWarning('glycerol-water', given, chengRange, true),
    }
  },
}

function tabulated(oil: TabulatedLiquid): LibraryLiquid {
  const range = {
    min: oil.referenceTemperature - OIL_TEMPERATURE_WINDOW,
    max: oil.referenceTemperature + OIL_TEMPERATURE_WINDOW,
  }
  const method: Method = { id: `library-${oil.id}`, source: oil.source }
  return {
    id: oil.id,
    name: oil.name,
    parameters: [],
    temperatureRange: range,
    sources: [oil.source],
    properties(temperature) {
      const ok = temperature >= range.min && temperature <= range.max
      return {
        liquid: {
          id: oil.id,
          name: oil.name,
          viscosity: quantity(oil.viscosity, UNIT.viscosity, method, ok),
          density: quantity(oil.density, UNIT.density, method, ok),
          surfaceTension: quantity(oil.surfaceTension, UNIT.tension, method, ok),
        },
        warnings: rangeWarning(oil.id, temperature, range),
      }
    },
  }
}

export const LIQUIDS: readonly LibraryLiquid[] = [water, glycerolWater, ...OILS.map(tabulated)]

export function findLiquid(id: string, liquids: readonly LibraryLiquid[] = LIQUIDS): LibraryLiquid | undefined {
  return liquids.find(liquid => liquid.id === id)
}
