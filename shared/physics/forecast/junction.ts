// One junction's forecast from resolved SI inputs: dimensionless groups, pressures, regime and droplet train.
import * as D from '../junction/dimensionless'
import { ENTRY_BARRIER, entryBarrier, LAPLACE_PLUG, laplacePlug } from '../junction/laplace'
import {
  DISPERSED_FRACTION,
  dispersedFraction,
  GENERATION_RATE,
  generationRate,
  PLUG_VOLUME,
  SPHERE_EQUIVALENT,
  sphereEquivalentDiameter,
  TRAIN_SPACING,
  trainSpacing,
} from '../junction/plugVolume'
import { classifyRegime, type Regime } from '../junction/regime'
import { STEP_DIAMETER_FACTOR, STEP_WETTING } from '../junction/step'
import { INPUT, quantity, type Method, type Warning } from '../quantity'
import {
  UNIT,
  type CubicMetres,
  type CubicMetresPerSecond,
  type KilogramsPerCubicMetre,
  type Metres,
  type NewtonsPerMetre,
  type PascalSeconds,
  type Radians,
} from '../units'
import { estimateSize } from './size'
import type { JunctionForecast, ResolvedJunction } from './types'

/** Creeping-flow scaling laws assume inertia is small (Christopher & Anna 2007); flagged above this Re. */
const REYNOLDS_LIMIT = 10
/** Gravity negligible against tension below this Bond number. */
const BOND_LIMIT = 0.1

/** The groups that pick the breakup regime (conventions in junction/dimensionless.ts), and the regime. */
export function breakupGroups(j: ResolvedJunction): {
  dh: Metres
  ca: number
  re: number
  we: number
  readonly regime: Regime
} {
  const w = j.mainWidth as Metres
  const h = j.depth as Metres
  const step = j.kind === 'step'
  const gamma = j.interfacialTension.value as NewtonsPerMetre
  const muC = j.continuous.viscosity.value as PascalSeconds
  const muD = j.dispersed.viscosity.value as PascalSeconds
  const rhoD = j.dispersed.density.value as KilogramsPerCubicMetre
  const dh = D.hydraulicDiameter(w, h)
  const uc = D.meanSpeed(j.flowContinuous, w, h)
  const ud = D.meanSpeed(j.flowDispersed, (step ? w : j.inletWidth) as Metres, h)
  const ca = step ? D.capillaryNumber(muD, ud, gamma) : D.capillaryNumber(muC, uc, gamma)
  const re = step
    ? D.reynoldsNumber(rhoD, ud, dh, muD)
    : D.reynoldsNumber(j.continuous.density.value as KilogramsPerCubicMetre, uc, dh, muC)
  const we = D.weberNumber(rhoD, ud, (step ? h : j.inletWidth) as Metres, gamma)
  // The regime object is built only when read (the operating window asks for Ca and We thousands of times).
  return {
    dh,
    ca,
    re,
    we,
    get regime() {
      return classifyRegime(j.kind, ca, we, muD / muC)
    },
  }
}

/** Drop volume (m³) and frequency (Hz) only, for the network's coupled iteration. */
export function dropTrain(j: ResolvedJunction): { volume: number; frequency: number } {
  // A step nozzle's size does not depend on the regime (d ≈ 4h); skip classifying it.
  const volume =
    j.kind === 'step'
      ? (Math.PI / 6) * (STEP_DIAMETER_FACTOR * j.depth) ** 3
      : estimateSize(j, breakupGroups(j).regime, true).volume
  return { volume, frequency: j.flowDispersed / volume }
}

interface TrainMethods {
  volume: Method
  diameter: Method
  frequency: Method
  spacing: Method
}
const trainMethodsOf = new WeakMap<Method, TrainMethods>()

/** The methods of the quantities derived from a size law, built once per law (not per junction per forecast). */
function trainMethods(size: Method): TrainMethods {
  let methods = trainMethodsOf.get(size)
  if (!methods) {
    const train = `${size.id}+${GENERATION_RATE.id}`
    methods = {
      volume: { id: `${size.id}+${PLUG_VOLUME.id}`, source: `${size.source}; ${PLUG_VOLUME.source}` },
      diameter: { id: `${size.id}+${SPHERE_EQUIVALENT.id}`, source: `${size.source}; ${SPHERE_EQUIVALENT.source}` },
      frequency: { id: train, source: `${size.source}; ${GENERATION_RATE.source}` },
      spacing: { id: `${train}+${TRAIN_SPACING.id}`, source: `${size.source}; ${TRAIN_SPACING.source}` },
    }
    trainMethodsOf.set(size, methods)
  }
  return methods
}

export function forecastJunction(j: ResolvedJunction, liquidWarnings: Warning[] = []): JunctionForecast {
  const w = j.mainWidth as Metres
  const win = j.inletWidth as Metres
  const h = j.depth as Metres
  const gamma = j.interfacialTension.value as NewtonsPerMetre
  const muC = j.continuous.viscosity.value as PascalSeconds
  const muD = j.dispersed.viscosity.value as PascalSeconds
  const rhoC = j.continuous.density.value as KilogramsPerCubicMetre
  const rhoD = j.dispersed.density.value as KilogramsPerCubicMetre
  const qc = j.flowContinuous as CubicMetresPerSecond
  const qd = j.flowDispersed as CubicMetresPerSecond
  const step = j.kind === 'step'
  const warnings: Warning[] = [...liquidWarnings]
  const propertiesValid = [
    j.continuous.viscosity,
    j.continuous.density,
    j.dispersed.viscosity,
    j.dispersed.density,
    j.interfacialTension,
  ].every(q => q.valid)

  const { dh, ca, re, we, regime } = breakupGroups(j)
  const bo = D.bondNumber(rhoD - rhoC, dh, gamma)
  const oh = D.ohnesorgeNumber(muD, rhoD, gamma, Math.min(w, h) as Metres)

  if (re > REYNOLDS_LIMIT)
    warnings.push({
      code: 'inertia',
      message: `Re = ${re.toPrecision(3)} > ${REYNOLDS_LIMIT}: the creeping-flow size laws lose accuracy; lower the flow rates or use a smaller channel`,
    })
  if (bo > BOND_LIMIT)
    warnings.push({
      code: 'gravity',
      message: `Bo = ${bo.toPrecision(3)} > ${BOND_LIMIT}: gravity is not negligible against interfacial tension at this size`,
    })

  let wets = false
  let entryPressure
  if (j.contactAngle !== undefined) {
    const constriction = (j.kind === 't-junction' ? Math.min(win, w) : w) as Metres
    entryPressure = quantity(
      entryBarrier(gamma, j.contactAngle as Radians, constriction, h),
      UNIT.pressure,
      ENTRY_BARRIER,
    )
    wets = j.contactAngle < Math.PI / 2
    if (wets) {
      warnings.push({
        code: 'dispersed-wets-walls',
        message: `Contact angle ${((j.contactAngle * 180) / Math.PI).toFixed(0)}° < 90°: the dispersed phase wets the walls, so drops will not pinch off reliably; treat the walls (e.g. make them ${step ? 'wetted by the oil' : 'hydrophobic for water-in-oil'}) — ${STEP_WETTING.source}`,
      })
    }
  }

  const size = estimateSize(j, regime)
  warnings.push(...size.warnings)
  if (!regime.valid && !warnings.length) {
    warnings.push({
      code: 'regime-indicative',
      message: `The ${regime.value} regime's thresholds (${regime.criterion.name} band ${regime.criterion.band.join('–')}) are indicative for this junction kind: ${regime.source}`,
    })
  }
  const sizeValid = size.valid && !wets && propertiesValid
  if (!propertiesValid)
    warnings.push({
      code: 'properties-out-of-range',
      message: "A liquid property is outside its correlation's range (see inputs); every size is marked invalid",
    })
  const volume = size.volume as CubicMetres
  const frequency = generationRate(qd, volume)
  const methods = trainMethods(size.method)

  const forecast: JunctionForecast = {
    inputs: {
      junction: {
        kind: j.kind,
        mainWidth: quantity(w, UNIT.length, INPUT),
        inletWidth: quantity(win, UNIT.length, INPUT),
        depth: quantity(h, UNIT.length, INPUT),
      },
      continuous: j.continuous,
      dispersed: j.dispersed,
      interfacialTension: j.interfacialTension,
      temperature: quantity(j.temperature, UNIT.temperature, INPUT),
      flow: { continuous: quantity(qc, UNIT.flow, INPUT), dispersed: quantity(qd, UNIT.flow, INPUT) },
      model: j.alpha === undefined ? {} : { alpha: j.alpha },
    },
    capillaryNumber: quantity(ca, UNIT.none, step ? D.CAPILLARY_DISPERSED : D.CAPILLARY),
    reynoldsNumber: quantity(re, UNIT.none, D.REYNOLDS),
    weberNumber: quantity(we, UNIT.none, D.WEBER),
    bondNumber: quantity(bo, UNIT.none, D.BOND),
    ohnesorgeNumber: quantity(oh, UNIT.none, D.OHNESORGE),
    viscosityRatio: quantity(muD / muC, UNIT.none, D.RATIO),
    flowRateRatio: quantity(qd / qc, UNIT.none, D.RATIO),
    laplacePressure: quantity(laplacePlug(gamma, w, h), UNIT.pressure, LAPLACE_PLUG),
    regime,
    dropletVolume: quantity(volume, UNIT.volume, size.length === undefined ? size.method : methods.volume, sizeValid),
    dropletDiameter: quantity(sphereEquivalentDiameter(volume), UNIT.length, methods.diameter, sizeValid),
    frequency: quantity(frequency, UNIT.frequency, methods.frequency, sizeValid),
    dispersedFraction: quantity(dispersedFraction(qc, qd), UNIT.none, DISPERSED_FRACTION),
    warnings,
  }
  if (j.contactAngle !== undefined) forecast.inputs.contactAngle = quantity(j.contactAngle, UNIT.angle, INPUT)
  if (entryPressure) forecast.entryPressure = entryPressure
  if (rhoD !== rhoC)
    forecast.capillaryLength = quantity(D.capillaryLength(rhoD - rhoC, gamma), UNIT.length, D.CAPILLARY_LENGTH)
  if (size.length !== undefined) {
    forecast.dropletLength = quantity(size.length, UNIT.length, size.method, sizeValid)
    forecast.spacing = quantity(trainSpacing(qc, qd, w, h, frequency), UNIT.length, methods.spacing, sizeValid)
  }
  return forecast
}
