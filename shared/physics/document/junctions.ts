// Every junction of the compiled chip forecast from its local flows, with the operating point's liquids,
// tension, contact angle and temperature, by the single-junction core (forecast/junction.ts).
import { forecastJunction } from '../forecast/junction'
import type { JunctionForecast, ResolvedJunction } from '../forecast/types'
import type { JunctionKind } from '../junction/regime'
import { ENTRY_BARRIER } from '../junction/laplace'
import { quantity, type Method } from '../quantity'
import { UNIT } from '../units'
import type { TwoPhaseSolution } from './twophase'
import type { ResolvedOperatingPoint } from './operating-point'
import type {
  CompiledJunction,
  DocumentJunction,
  DocumentJunctionKind,
  DocumentSource,
  DocumentWarning,
  OperatingWindow,
} from './types'

/** The single-junction method each document kind is forecast by. */
export const CORE_KIND: Record<DocumentJunctionKind, JunctionKind> = {
  't-junction': 't-junction',
  'y-junction': 't-junction',
  'flow-focusing': 'flow-focusing',
  'step-nozzle': 'step',
  'step-array': 'step',
}

/**
 * A Y-junction is forecast by the T-junction laws with its outlet as the main channel. Those laws were derived
 * and checked for perpendicular inlets (Garstecki et al. 2006, Lab Chip 6, 437; van Steijn et al. 2010, Chem.
 * Eng. Sci. 65, 5413); for inclined inlets they are an approximation we have not checked against data, so
 * every size is marked invalid.
 */
export const Y_AS_T: Method = {
  id: 'y-junction-as-t-junction',
  source:
    'T-junction squeezing laws applied to a Y-junction (an approximation, unchecked for inclined inlets): lower confidence',
}

export function forecastJunctions(
  junctions: CompiledJunction[],
  flows: Float64Array,
  op: ResolvedOperatingPoint,
  flowScale: number,
  solved?: TwoPhaseSolution,
  sources: DocumentSource[] = [],
  windows: OperatingWindow[] = [],
): { junctions: DocumentJunction[]; warnings: DocumentWarning[] } {
  const warnings: DocumentWarning[] = []
  const portAt = new Map(sources.map(s => [s.node, s]))
  // Below this a flow is rounding noise of the solve, not a flow.
  const zero = 1e-9 * flowScale
  const answer = junctions.map((j, index): DocumentJunction => {
    const entry: DocumentJunction = { id: j.id, kind: j.kind, element: j.element, forecast: null }
    if (j.nozzle !== undefined) entry.nozzle = j.nozzle
    const arm = solved?.arms[index]
    if (arm?.barrier !== undefined) {
      entry.entry = { barrier: quantity(arm.barrier, UNIT.pressure, ENTRY_BARRIER), state: arm.state }
      if (arm.state !== 'open') {
        const source = arm.source !== undefined ? portAt.get(arm.source) : undefined
        const deficit = arm.barrier - (arm.drive ?? 0)
        if (source && source.mode === 'pressure' && source.kind === 'inlet') {
          const window = windows.find(w => w.port === source.port)
          const start = window ? window.from.value : source.pressure + deficit
          entry.entry.dropsFrom = window
            ? window.from
            : quantity(start, UNIT.pressure, {
                id: 'entry-barrier-onset',
                source: `the feed inlet's pressure raised by the arm's shortfall below its barrier; ${ENTRY_BARRIER.source}`,
              })
          warnings.push({
            code: 'below-entry-barrier',
            element: j.element,
            message: `No droplets at ${j.kind} "${j.id}" until inlet "${source.port}" reaches ≈ ${(start / 100).toPrecision(3)} mbar (now ${(source.pressure / 100).toPrecision(3)} mbar): the dispersed phase cannot enter the junction below its entry barrier of ${(arm.barrier / 100).toPrecision(3)} mbar`,
          })
        } else {
          warnings.push({
            code: 'below-entry-barrier',
            element: j.element,
            message: `No droplets at ${j.kind} "${j.id}": the pressure across its dispersed arm (${((arm.drive ?? 0) / 100).toPrecision(3)} mbar) is below its entry barrier of ${(arm.barrier / 100).toPrecision(3)} mbar; raise the dispersed feed by ≈ ${(deficit / 100).toPrecision(3)} mbar`,
          })
        }
        return entry
      }
    }
    const flow = (k: number) => (k >= 0 ? flows[k]! : 0)
    const qd = flow(j.dispersed)
    const qc =
      j.continuousRule === 'sum'
        ? j.continuous.reduce((sum, k) => sum + flow(k), 0)
        : Math.max(...j.continuous.map(k => Math.abs(flow(k))))
    const name = `${j.kind} "${j.id}"`
    if (qd < -zero) {
      warnings.push({
        code: 'dispersed-backflow',
        element: j.element,
        message: `At ${name} the dispersed phase flows back into its inlet (${(-qd * 6e10).toPrecision(3)} µL/min); raise the dispersed inlet's pressure or flow, or lower the continuous one`,
      })
      return entry
    }
    if (qd <= zero) {
      warnings.push({
        code: 'no-dispersed-flow',
        element: j.element,
        message: `No dispersed flow reaches ${name}, so it makes no drops; connect its dispersed terminal to a fed inlet`,
      })
      return entry
    }
    if (qc <= zero) {
      warnings.push({
        code: 'no-continuous-flow',
        element: j.element,
        message: `No continuous flow reaches ${name}${qc < -zero ? ' (it flows backwards)' : ''}; connect its continuous terminal to a fed inlet or raise that inlet's setting`,
      })
      return entry
    }
    if (!op.interfacialTension) return entry
    const resolved: ResolvedJunction = {
      kind: CORE_KIND[j.kind],
      mainWidth: j.mainWidth,
      inletWidth: j.inletWidth,
      depth: j.depth,
      continuous: op.continuous,
      dispersed: op.dispersed,
      interfacialTension: op.interfacialTension,
      temperature: op.temperature,
      flowContinuous: qc,
      flowDispersed: qd,
    }
    if (op.contactAngle !== undefined) resolved.contactAngle = op.contactAngle
    const forecast = forecastJunction(resolved, op.warnings)
    entry.forecast = j.kind === 'y-junction' ? asYJunction(forecast, j.id) : forecast
    return entry
  })
  if (!op.interfacialTension && op.tensionProblem && junctions.length) warnings.push(op.tensionProblem)
  return { junctions: answer, warnings }
}

function asYJunction(forecast: JunctionForecast, id: string): JunctionForecast {
  for (const q of [
    forecast.dropletLength,
    forecast.dropletVolume,
    forecast.dropletDiameter,
    forecast.frequency,
    forecast.spacing,
  ]) {
    if (q) ((q.valid = false), (q.method = `${q.method}+${Y_AS_T.id}`))
  }
  forecast.warnings.push({
    code: 'y-junction-lower-confidence',
    message: `Y-junction "${id}" is forecast by the T-junction laws with its outlet as the main channel; sizes are lower confidence and marked invalid — calibrate with measured droplets`,
  })
  return forecast
}
