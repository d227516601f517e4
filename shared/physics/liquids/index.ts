// Public face of the liquids library (what GET /api/v1/liquids lists).
import { BUILT_IN_LIBRARY, type LiquidLibrary } from './lab'

export { LIQUIDS, findLiquid, type LibraryLiquid, type LiquidProperties } from './library'
export { PAIRS, SURFACTANTS, findPair, type LiquidPair, type Surfactant } from './pairs'
export {
  BUILT_IN_LIBRARY,
  mergeLibrary,
  labLiquid,
  labPair,
  labLiquidRange,
  type LabLiquidData,
  type LabLiquidRow,
  type LabPairData,
  type LabLiquidsData,
  type LiquidLibrary,
} from './lab'

export interface LiquidListing {
  id: string
  name: string
  /** Built into Dropwright, or the lab's own entry. */
  origin: 'built-in' | 'lab'
  parameters: string[]
  temperatureRange: { min: number; max: number; unit: 'K' }
  sources: string[]
  /** Properties at 20 °C (massFraction 0.5 where needed), as a preview. */
  at20C: {
    viscosity: number
    density: number
    surfaceTension: number | null
    unit: { viscosity: 'Pa*s'; density: 'kg/m^3'; surfaceTension: 'N/m' }
  }
}

export interface PairListing {
  liquids: [string, string]
  surfactant: string
  origin: 'built-in' | 'lab'
  interfacialTension: { value: number; unit: 'N/m'; source: string }
}

/** The whole library (built-in, plus the lab's when given) as plain JSON: liquids, pairs and surfactant names. */
export function listLiquids(library: LiquidLibrary = BUILT_IN_LIBRARY): {
  liquids: LiquidListing[]
  pairs: PairListing[]
  surfactants: string[]
} {
  const liquids = library.liquids.map(liquid => {
    const { liquid: at20 } = liquid.properties(293.15 as never, liquid.parameters.length ? 0.5 : undefined)
    return {
      id: liquid.id,
      name: liquid.name,
      origin: liquid.origin ?? ('built-in' as const),
      parameters: [...liquid.parameters],
      temperatureRange: { ...liquid.temperatureRange, unit: 'K' as const },
      sources: [...liquid.sources],
      at20C: {
        viscosity: at20.viscosity.value,
        density: at20.density.value,
        surfaceTension: at20.surfaceTension?.value ?? null,
        unit: { viscosity: 'Pa*s' as const, density: 'kg/m^3' as const, surfaceTension: 'N/m' as const },
      },
    }
  })
  const pairs = library.pairs.map(pair => ({
    liquids: [pair.liquids[0], pair.liquids[1]] as [string, string],
    surfactant: pair.surfactant,
    origin: pair.origin ?? ('built-in' as const),
    interfacialTension: { value: pair.interfacialTension, unit: 'N/m' as const, source: pair.source },
  }))
  return { liquids, pairs, surfactants: [...library.surfactants] }
}
