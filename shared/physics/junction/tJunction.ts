// T-junction droplet size in the squeezing regime.
import type { Method } from '../quantity'
import type { CubicMetres, Metres } from '../units'

export const GARSTECKI_SQUEEZING: Method = {
  id: 'garstecki-2006-squeezing',
  source:
    'L/w = 1 + α Qd/Qc (Garstecki, Fuerstman, Stone & Whitesides 2006, Lab Chip 6, 437, eq. 1); α given by the user or fitted',
}
export const VAN_STEIJN_SQUEEZING: Method = {
  id: 'van-steijn-2010-squeezing',
  source:
    'V/(hw²) = Vfill/(hw²) + α Qd/Qc with geometric Vfill and α (van Steijn, Kleijn & Kreutzer 2010, Lab Chip 10, 2513, eqs. 3–9; ' +
    'gutter leakage Qgutter/Qc = 0.1 and sharp corners as in the paper)',
}

/** Garstecki et al. 2006: L = w (1 + α Qd/Qc). Squeezing regime (Ca ≲ 0.01), h/w ≲ 1. */
export function garsteckiLength(width: Metres, alpha: number, flowRatio: number): Metres {
  return (width * (1 + alpha * flowRatio)) as Metres
}

/** Geometry range of van Steijn et al. 2010 (their Figs. 2–3): h/w ≤ 0.5 and 1/3 ≤ win/w ≤ 3. */
export function vanSteijnValid(width: Metres, inletWidth: Metres, depth: Metres): boolean {
  const hw = depth / width
  const ratio = inletWidth / width
  return hw > 0 && hw <= 0.5 && ratio >= 1 / 3 && ratio <= 3
}

/** Fill volume Vfill/(hw²), van Steijn et al. 2010 eq. 4 (win ≤ w) and eq. 5 (win > w). */
export function vanSteijnFillVolume(width: Metres, inletWidth: Metres, depth: Metres): number {
  const hw = depth / width
  const r = inletWidth / width
  const gutter = 1 - Math.PI / 4
  if (r <= 1) return (3 * Math.PI) / 8 - (Math.PI / 2) * gutter * hw
  const arc = Math.asin(1 - 1 / r)
  return (
    (Math.PI / 4 - arc / 2) * r ** 2 -
    0.5 * (r - 1) * Math.sqrt(2 * r - 1) +
    Math.PI / 8 -
    0.5 * gutter * ((Math.PI / 2 - arc) * r + Math.PI / 2) * hw
  )
}

/**
 * Squeezing coefficient α of van Steijn et al. 2010 (eqs. 7–9):
 * α = (1 − π/4)(1 − Qgutter/Qc)⁻¹ [ (Rpinch/w)² − (Rfill/w)² + (π/4)(h/w)(Rpinch/w − Rfill/w) ],
 * Rfill = max(w, win), Rpinch = w + win − p + √(2 (win − p)(w − p)), p = hw/(h + w) − ε (ε corner roundness).
 */
export function vanSteijnAlpha(
  width: Metres,
  inletWidth: Metres,
  depth: Metres,
  gutterFraction = 0.1,
  cornerRoundness = 0,
): number {
  const w = width
  const p = (depth * w) / (depth + w) - cornerRoundness
  const rPinch = (w + inletWidth - p + Math.sqrt(2 * (inletWidth - p) * (w - p))) / w
  const rFill = Math.max(w, inletWidth) / w
  const hw = depth / w
  return ((1 - Math.PI / 4) / (1 - gutterFraction)) * (rPinch ** 2 - rFill ** 2 + (Math.PI / 4) * hw * (rPinch - rFill))
}

/** Droplet volume V = h w² [Vfill/(hw²) + α Qd/Qc] (van Steijn et al. 2010, eq. 3). */
export function vanSteijnVolume(width: Metres, inletWidth: Metres, depth: Metres, flowRatio: number): CubicMetres {
  const scale = depth * width ** 2
  return (scale *
    (vanSteijnFillVolume(width, inletWidth, depth) +
      vanSteijnAlpha(width, inletWidth, depth) * flowRatio)) as CubicMetres
}

/**
 * Beyond squeezing the viscous shear of the continuous phase cuts the drop before it fills the channel, so its
 * length falls with Ca. Correlations of the form L/w = (squeezing term) · Ca^(−m) cover squeezing to dripping
 * (Xu, Li, Tan & Luo 2008, Microfluid. Nanofluid. 5, 711, from squeezing to dripping in T-junctions); we anchor
 * the power law to the squeezing size at the band's lower edge so the curve is continuous.
 */
export const XU_TRANSITION_DRIPPING: Method = {
  id: 'xu-2008-transition-dripping',
  source:
    'L = L_squeezing (Ca/Ca₀)^(−m) for Ca ≥ Ca₀ = 0.01, m = 0.2 (power-law form of Xu, Li, Tan & Luo 2008, Microfluid. Nanofluid. 5, 711; ' +
    'exponent from memory, anchoring at the squeezing band edge ours); lower confidence — indicative trend, calibrate with measured drops',
}
/** Where the power law takes over from the squeezing law (the De Menech band's lower edge). */
export const DRIPPING_ANCHOR_CA = 0.01
/** Exponent m of L ∝ Ca^(−m) (from memory). */
export const DRIPPING_EXPONENT = 0.2

/** Length of a drop beyond squeezing: the squeezing length at Ca₀ scaled by (Ca/Ca₀)^(−m). */
export function drippingLength(squeezingLength: Metres, ca: number): Metres {
  return (squeezingLength * (Math.max(ca, DRIPPING_ANCHOR_CA) / DRIPPING_ANCHOR_CA) ** -DRIPPING_EXPONENT) as Metres
}
