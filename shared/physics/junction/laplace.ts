// Young–Laplace pressures of droplet interfaces and the capillary entry barrier of a constriction.
import type { Method } from '../quantity'
import type { Metres, NewtonsPerMetre, Pascals, Radians } from '../units'

export const LAPLACE_SPHERE: Method = {
  id: 'young-laplace-sphere',
  source: 'Δp = 2γ/r (Young 1805; Laplace 1806; de Gennes et al. 2004, Capillarity and Wetting Phenomena, eq. 1.4)',
}
export const LAPLACE_THREAD: Method = {
  id: 'young-laplace-cylinder',
  source: 'Δp = γ/r for a cylindrical thread (Young–Laplace, one principal radius infinite)',
}
export const LAPLACE_PLUG: Method = {
  id: 'mayer-stowe-princen-confined-plug',
  source:
    'Δp = γ/r, r the corner-meniscus radius of a non-wetting plug in a w × h duct whose corners keep the continuous phase ' +
    '(Mayer & Stowe 1965, J. Colloid Sci. 20, 893; Princen 1969, J. Colloid Interface Sci. 30, 69; Wong, Radke & Morris 1995, ' +
    'J. Fluid Mech. 292, 71): (4 − π) r² − 2(w + h) r + w h = 0 for a perfectly wetting continuous phase; square duct Δp a/γ = 2 + √π ≈ 3.77 (Young–Laplace without gutters: 4)',
}
export const ENTRY_BARRIER: Method = {
  id: 'capillary-entry-barrier',
  source:
    'entry pressure of the dispersed phase into a w × h constriction, wall contact angle θ measured through it: Mayer–Stowe–Princen ' +
    'with corner menisci of the continuous phase (contact angle π − θ) when π − θ < 45°, else Young–Laplace −2γ cos θ (1/w + 1/h) ' +
    '(Princen 1969, J. Colloid Interface Sci. 30, 69; Lenormand, Zarcone & Sarr 1983, J. Fluid Mech. 135, 337; de Gennes et al. 2004, ch. 1)',
}

/** Half-angle of a rectangular duct's corners. */
const CORNER_HALF_ANGLE = Math.PI / 4

/**
 * Mayer–Stowe–Princen radius of the corner menisci of a non-wetting phase filling a w × h rectangle, the
 * wetting phase in the corners with contact angle θw < π/4 (energy balance of a piston-like advance:
 * A/r = arc length + cos θw · wall length). Quadratic a r² + b r + c = 0 per corner geometry (half-angle β = π/4).
 */
export function mspRadius(width: Metres, depth: Metres, wettingAngle = 0): Metres {
  const beta = CORNER_HALF_ANGLE
  const t = wettingAngle
  const cornerArea = (Math.cos(t) * Math.cos(t + beta)) / Math.sin(beta) - (Math.PI / 2 - t - beta)
  const cornerWall = (2 * Math.cos(t + beta)) / Math.sin(beta)
  const cornerArc = 2 * (Math.PI / 2 - t - beta)
  const a = 4 * (cornerArea + cornerArc - cornerWall * Math.cos(t))
  const b = 2 * (width + depth) * Math.cos(t)
  const c = -width * depth
  // At θw → π/4 the corners empty and the balance turns linear: r = wh / (2 (w + h) cos θw), Young–Laplace.
  if (Math.abs(a) < 1e-9) return (-c / b) as Metres
  // a < 0 for θw < π/4; the physical root is the smaller positive one.
  const disc = Math.sqrt(b * b - 4 * a * c)
  const roots = [(-b + disc) / (2 * a), (-b - disc) / (2 * a)].filter(r => r > 0)
  return Math.min(...roots) as Metres
}

/** Sphere of radius r. */
export const laplaceSphere = (tension: NewtonsPerMetre, radius: Metres): Pascals => ((2 * tension) / radius) as Pascals

/** Cylindrical thread of radius r. */
export const laplaceThread = (tension: NewtonsPerMetre, radius: Metres): Pascals => (tension / radius) as Pascals

/**
 * Cap pressure of a confined plug in a w × h channel, its corners keeping thin continuous-phase gutters
 * (perfect wetting of the continuous phase): γ / r_MSP. Below 2γ(1/w + 1/h), which ignores the gutters
 * (square duct: 3.77 γ/a against 4 γ/a). Valid when the drop is longer than the channel is wide.
 */
export const laplacePlug = (tension: NewtonsPerMetre, width: Metres, depth: Metres): Pascals =>
  (tension / mspRadius(width, depth, 0)) as Pascals

/**
 * Pressure the dispersed phase must exceed to enter a w × h constriction. With θ > 135° the continuous phase
 * stays in the corners and the Mayer–Stowe–Princen radius sets it (γ/r); otherwise −2γ cos θ (1/w + 1/h).
 * θ > 90° (continuous phase wets the wall, the working case) gives a positive barrier; θ < 90° a negative
 * one: the dispersed phase wicks in and wets the walls, and droplets do not pinch off reliably.
 * Quasi-static, sharp-edged constriction; ignores corner rounding.
 */
export function entryBarrier(tension: NewtonsPerMetre, contactAngle: Radians, width: Metres, depth: Metres): Pascals {
  const wetting = Math.PI - contactAngle
  if (wetting < CORNER_HALF_ANGLE) return (tension / mspRadius(width, depth, wetting)) as Pascals
  return (-2 * tension * Math.cos(contactAngle) * (1 / width + 1 / depth)) as Pascals
}
