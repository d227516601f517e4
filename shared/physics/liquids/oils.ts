// Common continuous-phase oils by generic chemical name. Single-temperature typical values; the library
// marks them valid only within ±10 K of their reference temperature (no temperature law is claimed).
import type { KilogramsPerCubicMetre, NewtonsPerMetre, PascalSeconds } from '../units'

export interface TabulatedLiquid {
  id: string
  name: string
  /** Reference temperature of the tabulated values, K. */
  referenceTemperature: number
  viscosity: PascalSeconds
  density: KilogramsPerCubicMetre
  surfaceTension: NewtonsPerMetre
  source: string
}

const MEMORY = 'typical value, from memory'

// Every value below is a typical handbook/datasheet figure recalled, not read: labs should override with their lot's data.
export const OILS: readonly TabulatedLiquid[] = [
  {
    id: 'n-hexadecane',
    name: 'n-hexadecane',
    referenceTemperature: 298.15,
    viscosity: 3.03e-3 as PascalSeconds,
    density: 770 as KilogramsPerCubicMetre,
    surfaceTension: 27.1e-3 as NewtonsPerMetre,
    source: `n-hexadecane at 25 °C: μ ≈ 3.0 mPa·s, ρ ≈ 770 kg/m³, σ ≈ 27 mN/m (${MEMORY})`,
  },
  {
    id: 'light-mineral-oil',
    name: 'light mineral oil',
    referenceTemperature: 298.15,
    viscosity: 28e-3 as PascalSeconds,
    density: 840 as KilogramsPerCubicMetre,
    surfaceTension: 30e-3 as NewtonsPerMetre,
    source: `light mineral (paraffin) oil at 25 °C: μ ≈ 20–35 mPa·s by grade, ρ ≈ 840 kg/m³, σ ≈ 30 mN/m (${MEMORY})`,
  },
  {
    id: 'silicone-oil-5cst',
    name: 'silicone oil (polydimethylsiloxane), 5 cSt',
    referenceTemperature: 298.15,
    viscosity: 4.6e-3 as PascalSeconds,
    density: 913 as KilogramsPerCubicMetre,
    surfaceTension: 19.7e-3 as NewtonsPerMetre,
    source: `PDMS fluid 5 cSt at 25 °C: ν = 5 mm²/s, ρ ≈ 913 kg/m³, σ ≈ 19.7 mN/m (${MEMORY})`,
  },
  {
    id: 'silicone-oil-50cst',
    name: 'silicone oil (polydimethylsiloxane), 50 cSt',
    referenceTemperature: 298.15,
    viscosity: 48e-3 as PascalSeconds,
    density: 960 as KilogramsPerCubicMetre,
    surfaceTension: 20.8e-3 as NewtonsPerMetre,
    source: `PDMS fluid 50 cSt at 25 °C: ν = 50 mm²/s, ρ ≈ 960 kg/m³, σ ≈ 20.8 mN/m (${MEMORY})`,
  },
  {
    id: 'hydrofluoroether',
    name: 'hydrofluoroether oil (ethoxy-dodecafluoro-trifluoromethylhexane)',
    referenceTemperature: 298.15,
    viscosity: 1.24e-3 as PascalSeconds,
    density: 1614 as KilogramsPerCubicMetre,
    surfaceTension: 16.2e-3 as NewtonsPerMetre,
    source: `segregated hydrofluoroether at 25 °C: ν ≈ 0.77 mm²/s, ρ ≈ 1614 kg/m³, σ ≈ 16 mN/m (${MEMORY})`,
  },
  {
    id: 'perfluorinated-oil',
    name: 'perfluorinated oil (perfluoro-tri-n-butylamine type)',
    referenceTemperature: 298.15,
    viscosity: 4.1e-3 as PascalSeconds,
    density: 1855 as KilogramsPerCubicMetre,
    surfaceTension: 16e-3 as NewtonsPerMetre,
    source: `perfluorinated amine oil at 25 °C: ν ≈ 2.2 mm²/s, ρ ≈ 1855 kg/m³, σ ≈ 16 mN/m (${MEMORY})`,
  },
]

/** ±10 K around the reference temperature: beyond it the single-point values are flagged, not extrapolated. */
export const OIL_TEMPERATURE_WINDOW = 10
