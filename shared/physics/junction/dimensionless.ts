// Dimensionless groups of a droplet junction. Conventions are stated per function; all inputs SI.
import type { Method } from '../quantity'
import {
  STANDARD_GRAVITY,
  type Dimensionless,
  type KilogramsPerCubicMetre,
  type Metres,
  type MetresPerSecond,
  type NewtonsPerMetre,
  type PascalSeconds,
} from '../units'

export const CAPILLARY: Method = {
  id: 'capillary-number',
  source:
    'Ca = μc U / γ (Christopher & Anna 2007, J. Phys. D 40, R319, sec. 2); U = Qc/(w h), continuous-phase mean speed in the main channel (orifice for flow-focusing)',
}
export const CAPILLARY_DISPERSED: Method = {
  id: 'capillary-number-dispersed-nozzle',
  source:
    'Ca = μd Ud / γ, Ud = Qd/(w h) mean dispersed-phase speed in the nozzle (step emulsification; Li, Leshansky, Pismen & Tabeling 2015, Lab Chip 15, 1023)',
}
export const REYNOLDS: Method = {
  id: 'reynolds-hydraulic-diameter',
  source:
    'Re = ρ U Dh / μ of the phase filling the channel (continuous in the main channel or orifice, dispersed in a step nozzle), Dh = 2wh/(w + h) (Bruus 2008, Theoretical Microfluidics, ch. 4)',
}
export const WEBER: Method = {
  id: 'weber-dispersed-inlet',
  source:
    'We = ρd Ud² ℓ / γ, dispersed phase at its mean speed in its inlet (ℓ = inlet width) or nozzle (ℓ = depth) (Utada et al. 2007, Phys. Rev. Lett. 99, 094502)',
}
export const BOND: Method = {
  id: 'bond-number',
  source: 'Bo = Δρ g Dh² / γ (Christopher & Anna 2007, J. Phys. D 40, R319)',
}
export const CAPILLARY_LENGTH: Method = {
  id: 'capillary-length',
  source: 'ℓc = √(γ / (Δρ g)) (de Gennes, Brochard-Wyart & Quéré 2004, Capillarity and Wetting Phenomena, ch. 2)',
}
export const OHNESORGE: Method = {
  id: 'ohnesorge-dispersed',
  source: 'Oh = μd / √(ρd γ L), L = smaller channel dimension (Eggers 1997, Rev. Mod. Phys. 69, 865)',
}
export const RATIO: Method = {
  id: 'ratio',
  source: 'definition: λ = μd/μc, flow-rate ratio Qd/Qc (φ is kept for the dispersed fraction Qd/(Qc + Qd))',
}

/** Mean speed of a volume flow through a w × h rectangle. */
export const meanSpeed = (flow: number, width: Metres, depth: Metres): MetresPerSecond =>
  (flow / (width * depth)) as MetresPerSecond

/** Dh = 4A/P = 2wh/(w + h) for a rectangle. */
export const hydraulicDiameter = (width: Metres, depth: Metres): Metres =>
  ((2 * width * depth) / (width + depth)) as Metres

/** Ca = μ U / γ. Valid for any positive inputs; meaning depends on the convention in CAPILLARY. */
export const capillaryNumber = (
  viscosity: PascalSeconds,
  speed: MetresPerSecond,
  tension: NewtonsPerMetre,
): Dimensionless => ((viscosity * speed) / tension) as Dimensionless

/** Re = ρ U Dh / μ. Creeping-flow laws used here assume Re ≲ 1–10. */
export const reynoldsNumber = (
  density: KilogramsPerCubicMetre,
  speed: MetresPerSecond,
  length: Metres,
  viscosity: PascalSeconds,
): Dimensionless => ((density * speed * length) / viscosity) as Dimensionless

/** We = ρ U² L / γ. */
export const weberNumber = (
  density: KilogramsPerCubicMetre,
  speed: MetresPerSecond,
  length: Metres,
  tension: NewtonsPerMetre,
): Dimensionless => ((density * speed ** 2 * length) / tension) as Dimensionless

/** Bo = |Δρ| g L² / γ: gravity against surface tension (≪ 1 in microchannels). */
export const bondNumber = (densityDifference: number, length: Metres, tension: NewtonsPerMetre): Dimensionless =>
  ((Math.abs(densityDifference) * STANDARD_GRAVITY * length ** 2) / tension) as Dimensionless

/** ℓc = √(γ/(|Δρ| g)); infinite for equal densities (returned as Infinity, callers must not emit it). */
export const capillaryLength = (densityDifference: number, tension: NewtonsPerMetre): Metres =>
  Math.sqrt(tension / (Math.abs(densityDifference) * STANDARD_GRAVITY)) as Metres

/** Oh = μ / √(ρ γ L). */
export const ohnesorgeNumber = (
  viscosity: PascalSeconds,
  density: KilogramsPerCubicMetre,
  tension: NewtonsPerMetre,
  length: Metres,
): Dimensionless => (viscosity / Math.sqrt(density * tension * length)) as Dimensionless
