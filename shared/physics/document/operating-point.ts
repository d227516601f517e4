// The operating point of a document: which one, its liquids and tension at its temperature, its inlet settings.
import type { ChipDocument, LiquidRef, OperatingPoint } from '../../schemas/chip'
import { ForecastInputError } from '../errors'
import { resolveLiquid, resolveTension, tensionTemperatureWarnings, type LiquidSpec } from '../forecast/resolve'
import { BUILT_IN_LIBRARY, type LiquidLibrary, type LiquidProperties } from '../liquids'
import { INPUT, quantity, type Quantity, type Warning } from '../quantity'
import { UNIT, ZERO_CELSIUS, type Kelvin } from '../units'
import { documentPath } from './paths'

export interface ResolvedOperatingPoint {
  point: OperatingPoint
  index: number
  temperature: Kelvin
  continuous: LiquidProperties
  dispersed: LiquidProperties
  /** Absent when neither given nor in the library: the network is still solved, junctions are not forecast. */
  interfacialTension?: Quantity
  tensionProblem?: Warning
  /** Radians. */
  contactAngle?: number
  warnings: Warning[]
}

/** The requested operating point, else the active one, else the only one. */
export function chooseOperatingPoint(doc: ChipDocument, id?: string): { point: OperatingPoint; index: number } {
  const ids = doc.operatingPoints.map(op => `"${op.id}"`).join(', ')
  if (doc.operatingPoints.length === 0) {
    throw new ForecastInputError([
      {
        path: 'document.operatingPoints',
        message: `Design "${doc.name}" has no operating point: add one with its liquids, temperature and a setting for every inlet`,
      },
    ])
  }
  const wanted =
    id ?? doc.activeOperatingPoint ?? (doc.operatingPoints.length === 1 ? doc.operatingPoints[0]!.id : undefined)
  if (wanted === undefined) {
    throw new ForecastInputError([
      {
        path: 'operatingPoint',
        message: `Design "${doc.name}" has ${doc.operatingPoints.length} operating points and no active one: name one of ${ids} in "operatingPoint"`,
      },
    ])
  }
  const index = doc.operatingPoints.findIndex(op => op.id === wanted)
  if (index < 0)
    throw new ForecastInputError([
      {
        path: 'operatingPoint',
        message: `Operating point "${wanted}" is not in design "${doc.name}": use one of ${ids}`,
      },
    ])
  return { point: doc.operatingPoints[index]!, index }
}

/** The document's liquid (viscosity in mPa·s) as the forecast's liquid spec (SI). */
function liquidSpec(ref: LiquidRef): LiquidSpec {
  if ('liquid' in ref)
    return ref.massFraction === undefined
      ? { liquid: ref.liquid }
      : { liquid: ref.liquid, massFraction: ref.massFraction }
  return {
    name: ref.name ?? 'liquid given by its properties',
    viscosity: ref.viscosityMPaS * 1e-3,
    density: ref.densityKgPerM3,
  }
}

/** Re-homes the library's issue paths ("continuous.liquid") onto the document ("document.operatingPoints[0].continuousLiquid.liquid"). */
function rehome(error: unknown, from: string, to: string): never {
  if (error instanceof ForecastInputError) {
    throw new ForecastInputError(
      error.issues.map(issue => ({
        path: issue.path.startsWith(from) ? to + issue.path.slice(from.length) : to,
        message: issue.message,
      })),
    )
  }
  throw error
}

export function resolveOperatingPoint(
  doc: ChipDocument,
  id?: string,
  library: LiquidLibrary = BUILT_IN_LIBRARY,
): ResolvedOperatingPoint {
  const { point, index } = chooseOperatingPoint(doc, id)
  const base = documentPath(['operatingPoints', index])
  const temperature = (point.temperatureC + ZERO_CELSIUS) as Kelvin
  const resolve = (ref: LiquidRef, field: 'continuousLiquid' | 'dispersedLiquid') => {
    try {
      return resolveLiquid(liquidSpec(ref), temperature, field, library)
    } catch (error) {
      return rehome(error, field, `${base}.${field}`)
    }
  }
  const continuous = resolve(point.continuousLiquid, 'continuousLiquid')
  const dispersed = resolve(point.dispersedLiquid, 'dispersedLiquid')
  const resolved: ResolvedOperatingPoint = {
    point,
    index,
    temperature,
    continuous: continuous.liquid,
    dispersed: dispersed.liquid,
    warnings: [...continuous.warnings, ...dispersed.warnings],
  }
  if (point.contactAngleDeg !== undefined) resolved.contactAngle = (point.contactAngleDeg * Math.PI) / 180
  if (point.interfacialTensionMNPerM !== undefined) {
    resolved.interfacialTension = quantity(point.interfacialTensionMNPerM * 1e-3, UNIT.tension, INPUT)
    return resolved
  }
  const surfactant = point.surfactant ?? 'none'
  const fix = `give "interfacialTensionMNPerM" at ${base} (e.g. 5 for a surfactant-laden pair)`
  if (!library.surfactants.includes(surfactant)) {
    resolved.tensionProblem = {
      code: 'tension-missing',
      message: `Operating point "${point.id}" names surfactant "${surfactant}", which is not in the library (${library.surfactants.join(', ')}): ${fix}; junctions are not forecast until then`,
    }
    return resolved
  }
  try {
    resolved.interfacialTension = resolveTension(undefined, continuous.liquid, dispersed.liquid, surfactant, library)
    resolved.warnings.push(...tensionTemperatureWarnings(resolved.interfacialTension, temperature))
  } catch (error) {
    if (!(error instanceof ForecastInputError)) throw error
    resolved.tensionProblem = {
      code: 'tension-missing',
      message: `Operating point "${point.id}": the interfacial tension of ${dispersed.liquid.id ?? dispersed.liquid.name} in ${continuous.liquid.id ?? continuous.liquid.name} with surfactant "${surfactant}" is not in the library; ${fix}; junctions are not forecast until then`,
    }
  }
  return resolved
}

const PRESSURE_PA = { mbar: 100, kPa: 1000, psi: 6894.757293168361 } as const // 1 psi = 6894.757… Pa (NIST SP 811, appendix B)
const FLOW_M3_PER_S = { 'uL/min': 1e-9 / 60, 'uL/h': 1e-9 / 3600, 'nL/min': 1e-12 / 60 } as const

/** An inlet setting in SI: pressure in Pa (gauge) or flow in m³/s. */
export function inletInSi(setting: OperatingPoint['inlets'][number]): { pressure: number } | { flow: number } {
  return setting.mode === 'pressure'
    ? { pressure: setting.value * PRESSURE_PA[setting.unit] }
    : { flow: setting.value * FLOW_M3_PER_S[setting.unit] }
}
