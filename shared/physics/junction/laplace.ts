// Young–Laplace pressures of droplet interfaces and the capillary entry barrier of a constriction.
import type { Method } from '../quantity'
import type { Metres, NewtonsPerMetre, Pascals, Radians } from '../units'

export const LAPLACE_SPHERE: Method = { id: 'young-laplace-sphere', source: 'Δp = 2γ/r (Young 1805; Laplace 1806; de Gennes et al. 2004, Capillarity and Wetting Phenomena, eq. 1.4)' }
export const LAPLACE_THREAD: Method = { id: 'young-laplace-cylinder', source: 'Δp = γ/r for a cylindrical thread (Young–Laplace, one principal radius infinite)' }
export const LAPLACE_PLUG: Method = {
  id: 'young-laplace-confined-plug',
  source: 'Δp = 2γ(1/w + 1/h), cap of a plug filling a w × h channel, principal radii w/2 and h/2 (Young–Laplace; cf. Garstecki et al. 2006, Lab Chip 6, 437)',
}
export const ENTRY_BARRIER: Method = {
  id: 'capillary-entry-barrier',
  source: 'Δp = −2γ cos θ (1/w + 1/h), Young–Laplace with the wall contact angle θ of the dispersed phase (measured through it) at a w × h constriction (de Gennes et al. 2004, ch. 1)',
}

/** Sphere of radius r. */
export const laplaceSphere = (tension: NewtonsPerMetre, radius: Metres): Pascals => ((2 * tension) / radius) as Pascals

/** Cylindrical thread of radius r. */
export const laplaceThread = (tension: NewtonsPerMetre, radius: Metres): Pascals => (tension / radius) as Pascals

/** Confined plug cap in a w × h channel: 2γ(1/w + 1/h). Valid when the drop is longer than the channel is wide. */
export const laplacePlug = (tension: NewtonsPerMetre, width: Metres, depth: Metres): Pascals =>
  (2 * tension * (1 / width + 1 / depth)) as Pascals

/**
 * Pressure the dispersed phase must exceed to enter a w × h constriction: −2γ cos θ (1/w + 1/h).
 * θ > 90° (continuous phase wets the wall, the working case) gives a positive barrier; θ < 90° a negative
 * one: the dispersed phase wicks in and wets the walls, and droplets do not pinch off reliably.
 * Quasi-static, sharp-edged constriction; ignores corner rounding.
 */
export const entryBarrier = (tension: NewtonsPerMetre, contactAngle: Radians, width: Metres, depth: Metres): Pascals =>
  (-2 * tension * Math.cos(contactAngle) * (1 / width + 1 / depth)) as Pascals
