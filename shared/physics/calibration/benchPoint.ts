// The operating point as it was really set at the bench: the design's point with the flows, pressures and
// temperature typed for a run, so the run is compared with the forecast at what was run, for every junction kind.
// Pure: the server forecasts the returned document like any other.
import type { ChipDocument } from '../../schemas/chip'
import type { BenchConditions } from '../../schemas/bench'

export type InletPhases = ReadonlyMap<string, 'continuous' | 'dispersed'>

export interface BenchPoint {
  document: ChipDocument
  operatingPointId: string
  /** What was changed, in people's words ("dispersed flow 2 µL/min over 2 inlets"); empty when nothing was. */
  applied: string[]
}

const UL_PER_MIN = { 'uL/min': 1, 'uL/h': 1 / 60, 'nL/min': 1e-3 } as const

/** Whether a run typed anything the forecast can use (flows, pressures, temperature). */
export function hasBenchSettings(c: BenchConditions): boolean {
  return [c.continuousFlow, c.dispersedFlow, c.continuousPressureMbar, c.dispersedPressureMbar, c.temperatureC].some(
    v => v !== undefined,
  )
}

/**
 * The document with operating point `operatingPointId` (or its first) as set at the bench: a typed flow of a phase
 * drives every inlet of that phase by flow (shared equally when there are several), a typed pressure drives them
 * by pressure, a typed temperature replaces the point's. `phases` says which phase each inlet port carries (the
 * forecast's `network.inlets`). Liquids and surfactant typed at the bench are kept with the run, not applied.
 */
export function benchPoint(
  doc: ChipDocument,
  operatingPointId: string | undefined,
  c: BenchConditions,
  phases: InletPhases,
): BenchPoint | null {
  const op = doc.operatingPoints.find(o => o.id === operatingPointId) ?? doc.operatingPoints[0]
  if (!op) return null
  const applied: string[] = []
  let inlets = op.inlets
  for (const phase of ['continuous', 'dispersed'] as const) {
    const flow = phase === 'continuous' ? c.continuousFlow : c.dispersedFlow
    const pressure = phase === 'continuous' ? c.continuousPressureMbar : c.dispersedPressureMbar
    if (flow === undefined && pressure === undefined) continue
    const ports = [...phases].filter(([, p]) => p === phase).map(([port]) => port)
    if (!ports.length) continue
    const share = flow ? (flow.value * UL_PER_MIN[flow.unit]) / ports.length : 0
    const others = inlets.filter(s => !ports.includes(s.portId))
    const set = ports.map(portId =>
      flow
        ? { portId, mode: 'flow' as const, value: share, unit: 'uL/min' as const }
        : { portId, mode: 'pressure' as const, value: pressure!, unit: 'mbar' as const },
    )
    inlets = [...others, ...set]
    const over = ports.length > 1 ? ` over ${ports.length} inlets` : ''
    applied.push(
      flow
        ? `${phase} flow ${flow.value} ${flow.unit.replace('u', 'µ')}${over}`
        : `${phase} pressure ${pressure} mbar${over}`,
    )
  }
  let temperatureC = op.temperatureC
  if (c.temperatureC !== undefined) {
    temperatureC = c.temperatureC
    applied.push(`temperature ${c.temperatureC} °C`)
  }
  if (!applied.length) return { document: doc, operatingPointId: op.id, applied }
  const bench = { ...op, inlets, temperatureC }
  return {
    document: { ...doc, operatingPoints: doc.operatingPoints.map(o => (o.id === op.id ? bench : o)) },
    operatingPointId: op.id,
    applied,
  }
}
