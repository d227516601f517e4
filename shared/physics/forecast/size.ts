// Droplet size by junction kind: picks the published method that applies and says when it does not.
import {
  CUBAUD_MASON_DRIPPING,
  FF_DRIPPING_ANCHOR_CA,
  flowFocusingDrippingFactor,
  flowFocusingLength,
  FLOW_FOCUSING_SQUEEZING,
} from '../junction/flowFocusing'
import { plugVolume, sphereVolume, plugLength } from '../junction/plugVolume'
import type { Regime } from '../junction/regime'
import { STEP_DIAMETER, STEP_MIN_ASPECT, STEP_MIN_CONTACT_ANGLE, stepAspectOk, stepDiameter } from '../junction/step'
import {
  DRIPPING_ANCHOR_CA,
  DRIPPING_EXPONENT,
  drippingLength,
  garsteckiLength,
  GARSTECKI_SQUEEZING,
  VAN_STEIJN_SQUEEZING,
  vanSteijnValid,
  vanSteijnVolume,
  XU_TRANSITION_DRIPPING,
} from '../junction/tJunction'
import type { Warning } from '../quantity'
import type { CubicMetres, Metres } from '../units'
import type { ResolvedJunction, SizeEstimate } from './types'

const DEFAULT_ALPHA = 1

function regimeWarnings(regime: Regime): Warning[] {
  if (regime.value === 'squeezing' || regime.value === 'step-emulsification') return []
  if (regime.value === 'transition') {
    return [
      {
        code: 'regime-transition',
        message: `Between ${regime.between!.join(' and ')} (${regime.criterion.name} = ${regime.criterion.value.toPrecision(3)}, band ${regime.criterion.band.join('–')}${regime.method.includes('christopher') ? '; dispersed phase < 1/50 as viscous as the continuous: no pure squeezing, Christopher et al. 2008' : ''}): the size law is marked invalid; expect size between the two regimes' predictions`,
      },
    ]
  }
  if (regime.value === 'dripping') {
    return [
      {
        code: 'dripping-lower-confidence',
        message: `Dripping regime (Ca = ${regime.criterion.value.toPrecision(3)}): the size falls as Ca grows; the dripping law is lower confidence and marked invalid`,
      },
    ]
  }
  return [
    {
      code: 'jetting',
      message: `Jetting (${regime.criterion.name} = ${regime.criterion.value.toPrecision(3)}): drops are large and polydisperse; no size law applies — lower the flow rates`,
    },
  ]
}

/**
 * The squeezing laws were set up and checked for channels no deeper than wide (Garstecki et al. 2006: h/w ≈ 0.3;
 * van Steijn et al. 2010: h/w ≤ 0.5). A deeper channel is flagged and its sizes are invalid.
 */
function deepChannel(w: Metres, h: Metres, warnings: Warning[]): boolean {
  if (h <= w) return false
  warnings.push({
    code: 'deep-channel',
    message: `Depth ${(h * 1e6).toPrecision(3)} µm exceeds the width ${(w * 1e6).toPrecision(3)} µm: the squeezing laws were set up for h ≤ w, so the size is marked invalid — make the channel wider than deep or calibrate α`,
  })
  return true
}

function tJunctionSize(j: ResolvedJunction, regime: Regime, quiet = false): SizeEstimate {
  const squeezing = tJunctionSqueezing(j, regime, quiet)
  const ca = regime.criterion.name === 'Ca' ? regime.criterion.value : undefined
  if (regime.value === 'squeezing' || ca === undefined || ca <= DRIPPING_ANCHOR_CA || squeezing.length === undefined)
    return squeezing
  // Transition and dripping: the squeezing length, shortened by the viscous shear (Xu et al. 2008 form).
  const w = j.mainWidth as Metres
  const h = j.depth as Metres
  const length = drippingLength(squeezing.length as Metres, ca)
  if (!quiet)
    squeezing.warnings.push({
      code: 'dripping-law-indicative',
      message: `Ca = ${ca.toPrecision(3)} is past squeezing: the length follows L ∝ Ca^(−${DRIPPING_EXPONENT}) from the squeezing size at Ca = ${DRIPPING_ANCHOR_CA} (indicative, exponent from memory); calibrate with measured drops`,
    })
  return {
    volume: plugVolume(length, w, h),
    length,
    method: {
      id: `${squeezing.method.id}+${XU_TRANSITION_DRIPPING.id}`,
      source: `${squeezing.method.source}; ${XU_TRANSITION_DRIPPING.source}`,
    },
    valid: false,
    warnings: squeezing.warnings,
  }
}

function tJunctionSqueezing(j: ResolvedJunction, regime: Regime, quiet = false): SizeEstimate {
  const w = j.mainWidth as Metres
  const h = j.depth as Metres
  const ratio = j.flowDispersed / j.flowContinuous
  const warnings = quiet ? [] : regimeWarnings(regime)
  const inRegime = regime.value === 'squeezing'
  if (j.alpha === undefined && vanSteijnValid(w, j.inletWidth as Metres, h)) {
    const volume = vanSteijnVolume(w, j.inletWidth as Metres, h, ratio)
    return { volume, length: plugLength(volume, w, h), method: VAN_STEIJN_SQUEEZING, valid: inRegime, warnings }
  }
  const alpha = j.alpha ?? DEFAULT_ALPHA
  if (j.alpha === undefined && !quiet) {
    warnings.push({
      code: 'alpha-default',
      message: `Geometry h/w = ${(h / w).toPrecision(3)}, win/w = ${(j.inletWidth / w).toPrecision(3)} is outside van Steijn et al. 2010 (h/w ≤ 0.5, 1/3 ≤ win/w ≤ 3); used α = 1 — fit α from measured droplets and pass model.alpha`,
    })
  }
  const length = garsteckiLength(w, alpha, ratio)
  const deep = deepChannel(w, h, quiet ? [] : warnings)
  return {
    volume: plugVolume(length, w, h),
    length,
    method: GARSTECKI_SQUEEZING,
    valid: inRegime && j.alpha !== undefined && !deep,
    warnings,
  }
}

function flowFocusingSize(j: ResolvedJunction, regime: Regime, quiet = false): SizeEstimate {
  const w = j.mainWidth as Metres
  const h = j.depth as Metres
  const length = flowFocusingLength(w, j.alpha ?? DEFAULT_ALPHA, j.flowDispersed / j.flowContinuous)
  const warnings = quiet ? [] : regimeWarnings(regime)
  if (!quiet)
    warnings.push({
      code: 'flow-focusing-low-confidence',
      message:
        j.alpha === undefined
          ? 'Flow-focusing size uses the linear squeezing-type law with α = 1 (low confidence, factor ~1.5); fit α from measured droplets and pass model.alpha'
          : 'Flow-focusing size uses the linear squeezing-type law with your α; valid only in the regime it was fitted in',
    })
  const ca = regime.criterion.name === 'Ca' ? regime.criterion.value : undefined
  if (regime.value !== 'squeezing' && ca !== undefined && ca > FF_DRIPPING_ANCHOR_CA) {
    const volume = plugVolume(length, w, h) * flowFocusingDrippingFactor(ca)
    if (!quiet)
      warnings.push({
        code: 'dripping-law-indicative',
        message: `Ca = ${ca.toPrecision(3)} at the orifice is past squeezing: the volume follows V ∝ Ca^(−1) (d ∝ Ca^(−1/3), Cubaud & Mason 2008) from the linear law at Ca = ${FF_DRIPPING_ANCHOR_CA}; indicative, calibrate with measured drops`,
      })
    return {
      volume,
      length: plugLength(volume as CubicMetres, w, h),
      method: {
        id: `${FLOW_FOCUSING_SQUEEZING.id}+${CUBAUD_MASON_DRIPPING.id}`,
        source: `${FLOW_FOCUSING_SQUEEZING.source}; ${CUBAUD_MASON_DRIPPING.source}`,
      },
      valid: false,
      warnings,
    }
  }
  const deep = deepChannel(w, h, warnings)
  return {
    volume: plugVolume(length, w, h),
    length,
    method: FLOW_FOCUSING_SQUEEZING,
    valid: regime.value === 'squeezing' && j.alpha !== undefined && !deep,
    warnings,
  }
}

function stepSize(j: ResolvedJunction, regime: Regime, quiet = false): SizeEstimate {
  const w = j.mainWidth as Metres
  const h = j.depth as Metres
  if (quiet) return { volume: sphereVolume(stepDiameter(h)), method: STEP_DIAMETER, valid: false, warnings: [] }
  const warnings = regimeWarnings(regime)
  let valid = regime.value === 'step-emulsification'
  if (!stepAspectOk(w, h)) {
    valid = false
    warnings.push({
      code: 'step-nozzle-too-narrow',
      message: `Nozzle width/depth = ${(w / h).toPrecision(3)} is below ${STEP_MIN_ASPECT}; widen the nozzle or make it shallower so drops break at the step`,
    })
  }
  if (j.contactAngle === undefined) {
    warnings.push({
      code: 'wetting-unchecked',
      message:
        'No contact angle given: step emulsification needs the continuous phase to wet the nozzle; give contactAngle to check it',
    })
  } else if (j.contactAngle < STEP_MIN_CONTACT_ANGLE && j.contactAngle >= Math.PI / 2) {
    valid = false
    warnings.push({
      code: 'step-wetting-angle',
      message: `Dispersed-phase contact angle ${((j.contactAngle * 180) / Math.PI).toFixed(0)}° is below the ≈ 120° step emulsification needs (Eggersdorfer et al. 2018): drops may not pinch off at the step — treat the nozzle so the continuous phase wets it better`,
    })
  }
  return { volume: sphereVolume(stepDiameter(h)), method: STEP_DIAMETER, valid, warnings }
}

/** `quiet`: the volume only, warnings not written (the network's coupled iteration calls this per junction per pass). */
export function estimateSize(j: ResolvedJunction, regime: Regime, quiet = false): SizeEstimate {
  const size =
    j.kind === 't-junction'
      ? tJunctionSize(j, regime, quiet)
      : j.kind === 'flow-focusing'
        ? flowFocusingSize(j, regime, quiet)
        : stepSize(j, regime, quiet)
  return size
}
