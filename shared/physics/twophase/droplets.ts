// Added resistance of the drops a channel carries: confined plugs (capillary caps) and dilute unconfined drops.
import type { Method } from '../quantity'

/**
 * Why this model. Fuerstman, Lai, Thurlow, Shevkoplyas, Stone & Whitesides 2007 (Lab Chip 7, 1479) split the
 * pressure drop of a channel carrying confined bubbles into (i) the liquid slugs, which flow as if no bubble
 * were there, (ii) the gutters and (iii) the curved caps; with no surfactant and with surfactant well above its
 * critical micelle concentration (the usual droplet-lab case) the caps dominate and the drop is set by the
 * NUMBER of drops in the channel, each cap pair adding a Bretherton-type Δp ∝ (γ/r) Ca^(2/3). Vanapalli et al.
 * 2009 (Lab Chip 9, 982) measured single-drop resistances that need their empirical fit per liquid pair, and
 * Jakiela et al. 2011 (Lab Chip 11, 3603) give drop speeds rather than pressure drops; so we take Fuerstman's
 * decomposition with Bretherton's cap law, which needs nothing but the channel, the flow and the tension.
 */
export const CONFINED_DROPS: Method = {
  id: 'fuerstman-2007-caps-bretherton',
  source:
    'Δp_channel = Δp_slugs + n Δp_drop (Fuerstman et al. 2007, Lab Chip 7, 1479: caps dominate at no or high surfactant); ' +
    'Δp_drop = 4.52 (3Ca)^(2/3) γ/r for a long drop (Bretherton 1961, J. Fluid Mech. 10, 166; coefficient from memory), ' +
    'r = half the smaller channel dimension (our adaptation to rectangles, common practice, no source); drops move at the mean speed',
}

/** Coefficient of Bretherton's pressure drop across a long bubble, Δp r/γ = 4.52 (3Ca)^(2/3) (from memory). */
export const BRETHERTON_COEFFICIENT = 4.52

export const DILUTE_DROPS: Method = {
  id: 'taylor-1932-dilute-emulsion',
  source:
    'μ_eff = μc [1 + φ (1 + 2.5λ)/(1 + λ)] for drops smaller than the channel, λ = μd/μc (Taylor 1932, Proc. R. Soc. Lond. A 138, 41); dilute, φ ≲ 0.1',
}

/** Volume fraction up to which Taylor's dilute-emulsion viscosity is used without a warning (common practice, no source). */
export const DILUTE_LIMIT = 0.1

/** Pressure drop across one long confined drop: 4.52 (3Ca)^(2/3) γ/r, Ca = μc U/γ. */
export function confinedDropPressure(viscosity: number, speed: number, tension: number, radius: number): number {
  const ca = (viscosity * speed) / tension
  return (BRETHERTON_COEFFICIENT * Math.cbrt((3 * ca) ** 2) * tension) / radius
}

/** Taylor's relative viscosity of a dilute emulsion at volume fraction φ and viscosity ratio λ. */
export function taylorRelativeViscosity(fraction: number, ratio: number): number {
  return 1 + (fraction * (1 + 2.5 * ratio)) / (1 + ratio)
}
