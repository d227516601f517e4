// Droplet size by junction kind: picks the published method that applies and says when it does not.
import { flowFocusingLength, FLOW_FOCUSING_SQUEEZING } from '../junction/flowFocusing'
import { plugVolume, sphereVolume } from '../junction/plugVolume'
import type { Regime } from '../junction/regime'
import { STEP_DIAMETER, STEP_MIN_ASPECT, stepAspectOk, stepDiameter } from '../junction/step'
import { garsteckiLength, GARSTECKI_SQUEEZING, VAN_STEIJN_SQUEEZING, vanSteijnValid, vanSteijnVolume } from '../junction/tJunction'
import { plugLength } from '../junction/plugVolume'
import type { Warning } from '../quantity'
import type { Metres } from '../units'
import type { ResolvedJunction, SizeEstimate } from './types'

const DEFAULT_ALPHA = 1

function regimeWarnings(regime: Regime): Warning[] {
  if (regime.value === 'squeezing' || regime.value === 'step-emulsification') return []
  if (regime.value === 'transition') {
    return [{ code: 'regime-transition', message: `Between ${regime.between!.join(' and ')} (${regime.criterion.name} = ${regime.criterion.value.toPrecision(3)}, band ${regime.criterion.band.join('–')}): the size law is marked invalid; expect size between the two regimes' predictions` }]
  }
  if (regime.value === 'dripping') {
    return [{ code: 'dripping-lower-confidence', message: `Dripping regime (Ca = ${regime.criterion.value.toPrecision(3)}): the squeezing law overestimates the size, which falls as Ca grows; treat the size as an upper bound (lower confidence)` }]
  }
  return [{ code: 'jetting', message: `Jetting (${regime.criterion.name} = ${regime.criterion.value.toPrecision(3)}): drops are large and polydisperse; no size law applies — lower the flow rates` }]
}

function tJunctionSize(j: ResolvedJunction, regime: Regime): SizeEstimate {
  const w = j.mainWidth as Metres
  const h = j.depth as Metres
  const ratio = j.flowDispersed / j.flowContinuous
  const warnings = regimeWarnings(regime)
  const inRegime = regime.value === 'squeezing'
  if (j.alpha === undefined && vanSteijnValid(w, j.inletWidth as Metres, h)) {
    const volume = vanSteijnVolume(w, j.inletWidth as Metres, h, ratio)
    return { volume, length: plugLength(volume, w, h), method: VAN_STEIJN_SQUEEZING, valid: inRegime, warnings }
  }
  const alpha = j.alpha ?? DEFAULT_ALPHA
  if (j.alpha === undefined) {
    warnings.push({
      code: 'alpha-default',
      message: `Geometry h/w = ${(h / w).toPrecision(3)}, win/w = ${(j.inletWidth / w).toPrecision(3)} is outside van Steijn et al. 2010 (h/w ≤ 0.5, 1/3 ≤ win/w ≤ 3); used α = 1 — fit α from measured droplets and pass model.alpha`,
    })
  }
  const length = garsteckiLength(w, alpha, ratio)
  return { volume: plugVolume(length, w, h), length, method: GARSTECKI_SQUEEZING, valid: inRegime && j.alpha !== undefined, warnings }
}

function flowFocusingSize(j: ResolvedJunction, regime: Regime): SizeEstimate {
  const w = j.mainWidth as Metres
  const h = j.depth as Metres
  const length = flowFocusingLength(w, j.alpha ?? DEFAULT_ALPHA, j.flowDispersed / j.flowContinuous)
  const warnings = regimeWarnings(regime)
  warnings.push({
    code: 'flow-focusing-low-confidence',
    message: j.alpha === undefined
      ? 'Flow-focusing size uses the linear squeezing-type law with α = 1 (low confidence, factor ~1.5); fit α from measured droplets and pass model.alpha'
      : 'Flow-focusing size uses the linear squeezing-type law with your α; valid only in the regime it was fitted in',
  })
  return { volume: plugVolume(length, w, h), length, method: FLOW_FOCUSING_SQUEEZING, valid: regime.value === 'squeezing' && j.alpha !== undefined, warnings }
}

function stepSize(j: ResolvedJunction, regime: Regime): SizeEstimate {
  const w = j.mainWidth as Metres
  const h = j.depth as Metres
  const warnings = regimeWarnings(regime)
  let valid = regime.value === 'step-emulsification'
  if (!stepAspectOk(w, h)) {
    valid = false
    warnings.push({ code: 'step-nozzle-too-narrow', message: `Nozzle width/depth = ${(w / h).toPrecision(3)} is below ${STEP_MIN_ASPECT}; widen the nozzle or make it shallower so drops break at the step` })
  }
  if (j.contactAngle === undefined) {
    warnings.push({ code: 'wetting-unchecked', message: 'No contact angle given: step emulsification needs the continuous phase to wet the nozzle; give contactAngle to check it' })
  }
  return { volume: sphereVolume(stepDiameter(h)), method: STEP_DIAMETER, valid, warnings }
}

export function estimateSize(j: ResolvedJunction, regime: Regime): SizeEstimate {
  if (j.kind === 't-junction') return tJunctionSize(j, regime)
  if (j.kind === 'flow-focusing') return flowFocusingSize(j, regime)
  return stepSize(j, regime)
}
