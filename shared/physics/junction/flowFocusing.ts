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
