// Interfacial tensions of common liquid pairs, with and without surfactant, by generic name.
import type { NewtonsPerMetre } from '../units'

export type Surfactant = 'none' | 'sorbitan-monooleate' | 'fluorinated-block-copolymer'
export const SURFACTANTS: readonly Surfactant[] = ['none', 'sorbitan-monooleate', 'fluorinated-block-copolymer']

export interface LiquidPair {
  /** Aqueous (dispersed) liquid id and oil (continuous) liquid id; lookup is order-free. */
  liquids: readonly [string, string]
  /** A built-in surfactant, or one a lab names in its own pairs. */
  surfactant: Surfactant | (string & {})
  interfacialTension: NewtonsPerMetre
  source: string
  /** 'lab' for a pair of the lab's own library. */
  origin?: 'lab'
}

const MEMORY = 'typical value, from memory'

// All figures near room temperature (20–25 °C, no temperature law: a forecast more than 10 K away warns
// `tension-temperature`, forecast/resolve.ts); with surfactant, above its critical micelle concentration
// (about 1–2 wt% in the oil). Recalled typical values: a lab should override them with a pendant-drop measurement.
export const PAIRS: readonly LiquidPair[] = [
  {
    liquids: ['water', 'n-hexadecane'],
    surfactant: 'none',
    interfacialTension: 52e-3 as NewtonsPerMetre,
    source: `water/n-hexadecane ≈ 52 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'n-hexadecane'],
    surfactant: 'sorbitan-monooleate',
    interfacialTension: 4e-3 as NewtonsPerMetre,
    source: `water/n-hexadecane with ~2 wt% sorbitan monooleate ≈ 3–5 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'light-mineral-oil'],
    surfactant: 'none',
    interfacialTension: 50e-3 as NewtonsPerMetre,
    source: `water/light mineral oil ≈ 50 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'light-mineral-oil'],
    surfactant: 'sorbitan-monooleate',
    interfacialTension: 4e-3 as NewtonsPerMetre,
    source: `water/light mineral oil with ~2 wt% sorbitan monooleate ≈ 3–5 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'silicone-oil-5cst'],
    surfactant: 'none',
    interfacialTension: 38e-3 as NewtonsPerMetre,
    source: `water/PDMS oil ≈ 35–40 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'silicone-oil-50cst'],
    surfactant: 'none',
    interfacialTension: 38e-3 as NewtonsPerMetre,
    source: `water/PDMS oil ≈ 35–40 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'hydrofluoroether'],
    surfactant: 'none',
    interfacialTension: 50e-3 as NewtonsPerMetre,
    source: `water/hydrofluoroether oil ≈ 50 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'hydrofluoroether'],
    surfactant: 'fluorinated-block-copolymer',
    interfacialTension: 3e-3 as NewtonsPerMetre,
    source: `water/hydrofluoroether with ~2 wt% PFPE–PEG block copolymer ≈ 2–5 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'perfluorinated-oil'],
    surfactant: 'none',
    interfacialTension: 52e-3 as NewtonsPerMetre,
    source: `water/perfluorinated oil ≈ 50–55 mN/m (${MEMORY})`,
  },
  {
    liquids: ['water', 'perfluorinated-oil'],
    surfactant: 'fluorinated-block-copolymer',
    interfacialTension: 5e-3 as NewtonsPerMetre,
    source: `water/perfluorinated oil with ~2 wt% PFPE–PEG block copolymer ≈ 3–6 mN/m (${MEMORY})`,
  },
]

export function findPair(
  a: string,
  b: string,
  surfactant: string,
  pairs: readonly LiquidPair[] = PAIRS,
): LiquidPair | undefined {
  return pairs.find(
    pair =>
      pair.surfactant === surfactant &&
      ((pair.liquids[0] === a && pair.liquids[1] === b) || (pair.liquids[0] === b && pair.liquids[1] === a)),
  )
}
