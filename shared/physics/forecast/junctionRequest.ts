// A parsed junction request → resolved SI inputs → forecast.
import { junctionRequest, type JunctionRequest } from '../../schemas/forecast'
import type { Warning } from '../quantity'
import type { Kelvin } from '../units'
import { forecastJunction } from './junction'
import { parseOrThrow } from './issues'
import { resolveLiquid, resolveTension } from './resolve'
import type { JunctionForecast, ResolvedJunction } from './types'

export const DEFAULT_TEMPERATURE = 293.15 as Kelvin

export function resolveJunctionRequest(request: JunctionRequest): { junction: ResolvedJunction; warnings: Warning[] } {
  const temperature = (request.temperature ?? DEFAULT_TEMPERATURE) as Kelvin
  const continuous = resolveLiquid(request.continuous, temperature, 'continuous')
  const dispersed = resolveLiquid(request.dispersed, temperature, 'dispersed')
  const tension = resolveTension(request.interfacialTension, continuous.liquid, dispersed.liquid, request.surfactant ?? 'none')
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
  return { junction, warnings: [...continuous.warnings, ...dispersed.warnings] }
}

export function runJunctionForecast(input: unknown): JunctionForecast {
  const request = parseOrThrow(junctionRequest, input)
  const { junction, warnings } = resolveJunctionRequest(request)
  return forecastJunction(junction, warnings)
}
