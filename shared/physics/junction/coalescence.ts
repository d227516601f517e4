// Energetics of two equal drops merging, for merging steps and emulsion-stability notes.
import type { Method } from '../quantity'
import type { Joules, KilogramsPerCubicMetre, Metres, MetresPerSecond, NewtonsPerMetre, Seconds } from '../units'

export const COALESCENCE: Method = {
  id: 'equal-drop-coalescence',
  source:
    'volume conservation R = 2^(1/3) r; surface energy 4πγr²(2 − 2^(2/3)); capillary–inertial speed √(γ/(ρ r)) (Eggers, Lister & Stone 1999, J. Fluid Mech. 401, 293)',
}

/** Radius of the drop formed by merging two equal drops of radius r: 2^(1/3) r ≈ 1.26 r. */
export const mergedRadius = (radius: Metres): Metres => (Math.cbrt(2) * radius) as Metres

/** Surface energy released: 2·4πγr² − 4πγ(2^(1/3) r)² = 4πγr²(2 − 2^(2/3)). */
export const releasedSurfaceEnergy = (tension: NewtonsPerMetre, radius: Metres): Joules =>
  (4 * Math.PI * tension * radius ** 2 * (2 - 2 ** (2 / 3))) as Joules

/** Capillary–inertial speed scale √(γ/(ρ r)), inviscid drops (Oh ≪ 1). */
export const capillaryInertialSpeed = (
  tension: NewtonsPerMetre,
  density: KilogramsPerCubicMetre,
  radius: Metres,
): MetresPerSecond => Math.sqrt(tension / (density * radius)) as MetresPerSecond

/** Capillary–inertial time √(ρ r³/γ). */
export const capillaryInertialTime = (
  tension: NewtonsPerMetre,
  density: KilogramsPerCubicMetre,
  radius: Metres,
): Seconds => Math.sqrt((density * radius ** 3) / tension) as Seconds
