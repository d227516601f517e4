// A parsed junction request → resolved SI inputs → forecast.
import { junctionRequest, type JunctionRequest } from '../../schemas/forecast'
import { BUILT_IN_LIBRARY, type LiquidLibrary } from '../liquids'
import type { Warning } from '../quantity'
import type { Kelvin } from '../units'
import { forecastJunction } from './junction'
import { parseOrThrow } from './issues'
import { resolveLiquid, resolveTension, tensionTemperatureWarnings } from './resolve'
import type { JunctionForecast, ResolvedJunction } from './types'

export const DEFAULT_TEMPERATURE = 293.15 as Kelvin

export function resolveJunctionRequest(
  request: JunctionRequest,
  library: LiquidLibrary = BUILT_IN_LIBRARY,
): { junction: ResolvedJunction; warnings: Warning[] } {
  const temperature = (request.temperature ?? DEFAULT_TEMPERATURE) as Kelvin
  const continuous = resolveLiquid(request.continuous, temperature, 'continuous', library)
  const dispersed = resolveLiquid(request.dispersed, temperature, 'dispersed', library)
  const tension = resolveTension(
    request.interfacialTension,
    continuous.liquid,
    dispersed.liquid,
    request.surfactant ?? 'none',
    library,
  )
  const junction: ResolvedJunction = {
    kind: request.junction.kind,
    mainWidth: request.junction.mainWidth,
    inletWidth: request.junction.inletWidth ?? request.junction.mainWidth,
    depth: request.junction.depth,
    continuous: continuous.liquid,
    dispersed: dispersed.liquid,
    interfacialTension: tension,
    temperature,
    flowContinuous: request.flow.continuous,
    flowDispersed: request.flow.dispersed,
  }
  if (request.contactAngle !== undefined) junction.contactAngle = request.contactAngle
  if (request.model?.alpha !== undefined) junction.alpha = request.model.alpha
  return {
    junction,
    warnings: [...continuous.warnings, ...dispersed.warnings, ...tensionTemperatureWarnings(tension, temperature)],
  }
}

export function runJunctionForecast(input: unknown, library: LiquidLibrary = BUILT_IN_LIBRARY): JunctionForecast {
  const request = parseOrThrow(junctionRequest, input)
  const { junction, warnings } = resolveJunctionRequest(request, library)
  return forecastJunction(junction, warnings)
}
