// Breakup regime with transition bands instead of hard switches.
import type { Method } from '../quantity'

export type RegimeName = 'squeezing' | 'transition' | 'dripping' | 'jetting' | 'step-emulsification'
export type JunctionKind = 't-junction' | 'flow-focusing' | 'step'

export interface Regime {
  value: RegimeName
  unit: ''
  method: string
  source: string
  /** False when the thresholds are only indicative for this geometry. */
  valid: boolean
  /** For 'transition': the two regimes it lies between. */
  between?: [RegimeName, RegimeName]
  criterion: { name: string; value: number; band: [number, number] }
}

export const DE_MENECH_BAND: Method = {
  id: 'de-menech-2008-squeezing-dripping',
  source:
    'squeezing → dripping at Ca ≈ 0.015 (De Menech, Garstecki, Jousse & Stone 2008, J. Fluid Mech. 595, 141); ' +
    'band 0.01–0.02 set here around it; see also Christopher & Anna 2007, J. Phys. D 40, R319',
}
export const UTADA_JETTING: Method = {
  id: 'utada-2007-jetting',
  source:
    'dripping → jetting when Ca_out + We_in ≈ 1 (Utada, Fernandez-Nieves, Stone & Weitz 2007, Phys. Rev. Lett. 99, 094502; coflow); band 0.7–1.3 set here',
}
export const STEP_CRITICAL: Method = {
  id: 'step-critical-capillary',
  source:
    'step emulsification holds below a critical nozzle capillary number of order 10⁻² that depends on viscosity ratio ' +
    '(Li, Leshansky, Pismen & Tabeling 2015, Lab Chip 15, 1023); band 0.01–0.03 is an indicative value, from memory',
}

/** Squeezing/dripping band on Ca (T-junction, De Menech et al. 2008). */
export const SQUEEZING_BAND: [number, number] = [0.01, 0.02]
/** Jetting band on Ca + We (Utada et al. 2007). */
export const JETTING_BAND: [number, number] = [0.7, 1.3]
/** Step emulsification band on the nozzle capillary number (indicative). */
export const STEP_BAND: [number, number] = [0.01, 0.03]

/**
 * Band edges are inclusive up to rounding: a Ca computed as 0.020000000000000004 from a nominal 0.02 is still in
 * the band the docs say includes 0.02. Relative slack 1e-9, far below any physical resolution.
 */
export const BAND_EDGE_SLACK = 1e-9

function regime(
  method: Method,
  valid: boolean,
  name: string,
  value: number,
  band: [number, number],
  below: RegimeName,
  above: RegimeName,
): Regime {
  const base = { unit: '' as const, method: method.id, source: method.source, valid, criterion: { name, value, band } }
  if (value < band[0] * (1 - BAND_EDGE_SLACK)) return { ...base, value: below }
  if (value > band[1] * (1 + BAND_EDGE_SLACK)) return { ...base, value: above }
  return { ...base, value: 'transition', between: [below, above] }
}

export const CHRISTOPHER_LOW_VISCOSITY: Method = {
  id: 'christopher-2008-no-squeezing-low-viscosity-ratio',
  source:
    'when the dispersed phase is at least 50 times less viscous than the continuous phase, no purely squeezing regime appears and size ' +
    'follows power laws in Ca (Christopher, Noharuddin, Taylor & Anna 2008, Phys. Rev. E 78, 036317)',
}

/** Viscosity ratio μd/μc below which a T-junction has no pure squeezing regime (Christopher et al. 2008). */
export const NO_SQUEEZING_RATIO = 1 / 50

/**
 * Regime of a junction. `ca` follows the kind's convention (continuous phase in the main channel or orifice;
 * dispersed phase in the nozzle for step), `we` is the dispersed-phase Weber number.
 * The T-junction thresholds are the published ones; for flow-focusing they are only indicative (valid: false).
 * With `viscosityRatio` μd/μc < 1/50 a T-junction below the band is transition, not squeezing (Christopher et al. 2008).
 */
export function classifyRegime(kind: JunctionKind, ca: number, we: number, viscosityRatio?: number): Regime {
  const jetting = ca + we
  if (kind === 'step') {
    if (jetting >= JETTING_BAND[0])
      return regime(UTADA_JETTING, false, 'Ca + We', jetting, JETTING_BAND, 'step-emulsification', 'jetting')
    return regime(STEP_CRITICAL, false, 'Ca (dispersed, nozzle)', ca, STEP_BAND, 'step-emulsification', 'jetting')
  }
  const published = kind === 't-junction'
  if (jetting >= JETTING_BAND[0])
    return regime(UTADA_JETTING, false, 'Ca + We', jetting, JETTING_BAND, 'dripping', 'jetting')
  const found = regime(DE_MENECH_BAND, published, 'Ca', ca, SQUEEZING_BAND, 'squeezing', 'dripping')
  if (published && found.value === 'squeezing' && viscosityRatio !== undefined && viscosityRatio < NO_SQUEEZING_RATIO) {
    return {
      ...found,
      value: 'transition',
      between: ['squeezing', 'dripping'],
      method: `${found.method}+${CHRISTOPHER_LOW_VISCOSITY.id}`,
      source: `${found.source}; ${CHRISTOPHER_LOW_VISCOSITY.source}`,
    }
  }
  return found
}

/** Same verdict as classifyRegime(kind, ca, we).value === 'jetting', without building the regime. */
export function isJetting(kind: JunctionKind, ca: number, we: number): boolean {
  const jetting = ca + we
  if (jetting >= JETTING_BAND[0]) return jetting > JETTING_BAND[1] * (1 + BAND_EDGE_SLACK)
  return kind === 'step' && ca > STEP_BAND[1] * (1 + BAND_EDGE_SLACK)
}
