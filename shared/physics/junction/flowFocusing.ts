// Flow-focusing cross: droplet size at low capillary number. Lower confidence than the T-junction law.
import type { Method } from '../quantity'
import type { Metres } from '../units'

export const FLOW_FOCUSING_SQUEEZING: Method = {
  id: 'flow-focusing-linear-scaling',
  source:
    'L/w = 1 + α Qd/Qc with w the orifice width, the squeezing-type linear law observed for confined flow-focusing at low Ca ' +
    '(Garstecki et al. 2006, Lab Chip 6, 437; Christopher & Anna 2007, J. Phys. D 40, R319, sec. 4.2). Confidence: low; ' +
    'α ≈ 1 unless calibrated, outcomes within a factor ~1.5 expected (typical value, from memory)',
}

/** Plug length downstream of the orifice: w (1 + α Qd/Qc). Confined (drop larger than the orifice) and Ca ≲ 0.01. */
export function flowFocusingLength(orificeWidth: Metres, alpha: number, flowRatio: number): Metres {
  return (orificeWidth * (1 + alpha * flowRatio)) as Metres
}

/**
 * Flow-focusing beyond squeezing: the thread breaks in the orifice before it fills it, and drop size falls
 * as the continuous phase's capillary number grows: d ∝ Ca^(−1/3) in the dripping regime of square
 * cross-junctions (Cubaud & Mason 2008, Phys. Fluids 20, 053302; exponent from memory). Anchored to the
 * linear law (Garstecki, Stone & Whitesides 2005, Phys. Rev. Lett. 94, 164501: confined, rate-of-collapse
 * controlled breakup) at Ca₀ = 0.01 so the curve is continuous.
 */
export const CUBAUD_MASON_DRIPPING: Method = {
  id: 'cubaud-mason-2008-dripping',
  source:
    'V = V_linear (Ca/Ca₀)^(−1) (d ∝ Ca^(−1/3)) for Ca ≥ Ca₀ = 0.01 at the orifice (Cubaud & Mason 2008, Phys. Fluids 20, 053302, exponent from memory; ' +
    'linear law of Garstecki, Stone & Whitesides 2005, Phys. Rev. Lett. 94, 164501 below it); lower confidence',
}
export const FF_DRIPPING_ANCHOR_CA = 0.01

/** Volume factor of the dripping law: (Ca/Ca₀)^(−1), i.e. d ∝ Ca^(−1/3). */
export function flowFocusingDrippingFactor(ca: number): number {
  return FF_DRIPPING_ANCHOR_CA / Math.max(ca, FF_DRIPPING_ANCHOR_CA)
}
