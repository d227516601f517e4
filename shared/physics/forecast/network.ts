// A network request → channel resistances → sparse solve → flows, pressures, inlet pressures, uniformity, margins.
import { networkRequest } from '../../schemas/forecast'
import { ForecastInputError, NetworkError } from '../errors'
import {
  circularResistance,
  HAGEN_POISEUILLE,
  RECT_APPROX,
  RECT_SERIES,
  rectangularResistance,
  rectangularResistanceApprox,
} from '../hydraulics/resistance'
import {
  flowUniformity,
  pressureMargin,
  pumpMargin,
  solveNetwork,
  suctionWarnings,
  type Margin,
  type NetworkSolution,
  type Uniformity,
} from '../network'
import { quantity, type Method, type Quantity, type Warning } from '../quantity'
import { UNIT, type Kelvin, type Metres, type PascalSeconds } from '../units'
import { parseOrThrow } from './issues'
import { DEFAULT_TEMPERATURE } from './junctionRequest'
import { resolveLiquid } from './resolve'
import { BUILT_IN_LIBRARY, type LiquidLibrary, type LiquidProperties } from '../liquids'

export const KIRCHHOFF: Method = {
  id: 'kirchhoff-sparse-pcg',
  source:
    'Kirchhoff current law on the channel network (Bruus 2008, Theoretical Microfluidics, sec. 4.5), solved by preconditioned conjugate gradient',
}

export interface NetworkForecast {
  liquid: LiquidProperties
  nodes: { id: string; pressure: Quantity }[]
  channels: { id: string; flow: Quantity; resistance: Quantity; pressureDrop: Quantity }[]
  inlets: { node: string; pressure: Quantity; flow: Quantity }[]
  uniformity?: (Uniformity & { channels: string[] })[]
  margins?: { bondPressure?: Margin; pumpPressure?: Margin }
  solver: { name: string; iterations: number; residual: number }
  warnings: Warning[]
}

type Channel = { id: string; from: string; to: string; length: number } & (
  { width: number; depth: number } | { diameter: number }
)

export function channelResistance(
  channel: Channel,
  viscosity: PascalSeconds,
  method: 'series' | 'approximate',
): { value: number; method: Method } {
  const length = channel.length as Metres
  if ('diameter' in channel)
    return { value: circularResistance(viscosity, length, channel.diameter as Metres), method: HAGEN_POISEUILLE }
  const rect = method === 'series' ? rectangularResistance : rectangularResistanceApprox
  return {
    value: rect(viscosity, length, channel.width as Metres, channel.depth as Metres),
    method: method === 'series' ? RECT_SERIES : RECT_APPROX,
  }
}

/** Maps a solver error onto the request field that caused it. */
export function networkIssue(error: NetworkError, prefix: string): ForecastInputError {
  const path =
    error.detail.sourceIndex !== undefined
      ? `${prefix}.sources.${error.detail.sourceIndex}.node`
      : error.detail.channelIndex !== undefined
        ? `${prefix}.channels.${error.detail.channelIndex}`
        : `${prefix}.sources`
  return new ForecastInputError([{ path, message: error.message }])
}

export function solveOrExplain(problem: Parameters<typeof solveNetwork>[0], prefix: string): NetworkSolution {
  try {
    return solveNetwork(problem)
  } catch (error) {
    if (error instanceof NetworkError) throw networkIssue(error, prefix)
    throw error
  }
}

export function runNetworkForecast(input: unknown, library: LiquidLibrary = BUILT_IN_LIBRARY): NetworkForecast {
  const { network } = parseOrThrow(networkRequest, input)
  const temperature = (network.temperature ?? DEFAULT_TEMPERATURE) as Kelvin
  const { liquid, warnings } = resolveLiquid(network.liquid, temperature, 'network.liquid', library)
  const viscosity = liquid.viscosity.value as PascalSeconds
  const method = network.resistanceMethod ?? 'series'
  const resistances = network.channels.map(channel => channelResistance(channel, viscosity, method))
  const solution = solveOrExplain(
    {
      channels: network.channels.map((channel, k) => ({
        id: channel.id,
        from: channel.from,
        to: channel.to,
        resistance: resistances[k]!.value,
      })),
      sources: network.sources,
    },
    'network',
  )
  const channelIndex = new Map(network.channels.map((channel, k) => [channel.id, k]))
  const answer: NetworkForecast = {
    liquid,
    nodes: solution.nodeIds.map((id, i) => ({
      id,
      pressure: quantity(solution.pressure[i]!, UNIT.pressure, KIRCHHOFF),
    })),
    channels: network.channels.map((channel, k) => ({
      id: channel.id,
      flow: quantity(solution.flow[k]!, UNIT.flow, KIRCHHOFF),
      resistance: quantity(resistances[k]!.value, UNIT.resistance, resistances[k]!.method),
      pressureDrop: quantity(solution.flow[k]! * resistances[k]!.value, UNIT.pressure, KIRCHHOFF),
    })),
    inlets: solution.sources.map(s => ({
      node: s.node,
      pressure: quantity(s.pressure, UNIT.pressure, KIRCHHOFF),
      flow: quantity(s.flow, UNIT.flow, KIRCHHOFF),
    })),
    solver: { name: solution.solver, iterations: solution.iterations, residual: solution.residual },
    warnings,
  }
  if (network.parallelSets) {
    answer.uniformity = network.parallelSets.map((set, s) => {
      const flows = set.map((id, k) => {
        const index = channelIndex.get(id)
        if (index === undefined)
          throw new ForecastInputError([
            {
              path: `network.parallelSets.${s}.${k}`,
              message: `unknown channel "${id}"; list channel ids from network.channels`,
            },
          ])
        return solution.flow[index]!
      })
      return { ...flowUniformity(flows), channels: set }
    })
  }
  const inletPressures = solution.sources.map(s => s.pressure)
  if (network.limits) {
    answer.margins = {}
    if (network.limits.bondPressure !== undefined)
      answer.margins.bondPressure = pressureMargin(network.limits.bondPressure, inletPressures)
    if (network.limits.pumpPressure !== undefined)
      answer.margins.pumpPressure = pumpMargin(network.limits.pumpPressure, inletPressures)
    for (const [name, margin] of Object.entries(answer.margins)) {
      if (!margin.ok)
        warnings.push({
          code: 'pressure-limit',
          message: `An inlet needs ${margin.highest.toPrecision(3)} Pa, above the ${name} limit of ${margin.limit.toPrecision(3)} Pa; lower the flow or shorten narrow channels`,
        })
    }
  }
  warnings.push(...suctionWarnings(answer.inlets))
  return answer
}
