// Step emulsification: a confined dispersed tongue reaches a deep reservoir and breaks by the confinement gradient.
import type { Method } from '../quantity'
import type { Metres } from '../units'

export const STEP_DIAMETER: Method = {
  id: 'step-diameter-four-depths',
  source:
    'd ≈ 4 h below the critical capillary number, size set by the nozzle depth and nearly independent of flow ' +
    '(Dangla, Kayi & Baroud 2013, PNAS 110, 853; Li, Leshansky, Pismen & Tabeling 2015, Lab Chip 15, 1023); ' +
    'Shui, van den Berg & Eijkel 2011 (Microfluid. Nanofluid. 11, 87) measured 0.4–3.5 µm drops from 100–900 nm deep channels, ' +
    'd/h ≈ 3.9–4. The factor lies between about 3 and 5 in reported devices (typical value, from memory)',
}
export const STEP_ASPECT: Method = {
  id: 'step-nozzle-aspect',
  source:
    'nozzle width/depth must exceed about 2.6 for breakup at the step (Montessori et al. 2019, Phys. Fluids; ' +
    'threshold value, volume and page from memory)',
}
export const STEP_WETTING: Method = {
  id: 'step-wetting',
  source:
    "the continuous phase must wet the nozzle and step walls: drops pinch off only when the dispersed phase's contact angle " +
    'exceeds about 120° (Eggersdorfer, Seybold, Ofner, Weitz & Studart 2018, PNAS 115, 9479); below 90° it wets the walls outright (Dangla et al. 2013, PNAS 110, 853)',
}

/** Smallest dispersed-phase contact angle (rad) at which step emulsification pinches drops off: ≈ 120° (Eggersdorfer et al. 2018). */
export const STEP_MIN_CONTACT_ANGLE = (120 * Math.PI) / 180

export const STEP_DIAMETER_FACTOR = 4
export const STEP_MIN_ASPECT = 2.6

/** d = 4 h (Dangla et al. 2013; Li et al. 2015). */
export const stepDiameter = (nozzleDepth: Metres): Metres => (STEP_DIAMETER_FACTOR * nozzleDepth) as Metres

/** True when the nozzle is wide enough for its depth (w/h ≥ 2.6, Montessori et al. 2019). */
export const stepAspectOk = (nozzleWidth: Metres, nozzleDepth: Metres): boolean =>
  nozzleWidth / nozzleDepth >= STEP_MIN_ASPECT
