// The window of one junction: a grid of continuous × dispersed flows, each point forecast by the core.
import { forecastJunction } from '../forecast/junction'
import type { JunctionForecast, ResolvedJunction } from '../forecast/types'
import type { Warning } from '../quantity'
import { UNIT } from '../units'
import { logSpace } from './grid'
import type { PlanTarget, Scan, ScanPoint } from './types'

/** Is a forecast's size inside the target (and its rate at least the minimum)? */
export function hitsTarget(diameter: number, frequency: number, target: PlanTarget): boolean {
  return (
    Math.abs(diameter - target.diameter) <= target.tolerance * target.diameter &&
    (target.minFrequency === undefined || frequency >= target.minFrequency)
  )
}

/** The first warning that says why a size is not valid there (for the map's tooltip). */
export function whyInvalid(f: JunctionForecast): string | undefined {
  if (f.dropletDiameter.valid) return undefined
  // Inertia and jetting say most about a point, then the rest in the forecast's order.
  for (const w of f.warnings) if (w.code === 'inertia' || w.code === 'jetting') return w.code
  return f.warnings.find(w => w.code !== 'wetting-unchecked')?.code
}

export function pointFromForecast(
  f: JunctionForecast,
  target: PlanTarget,
  at: Pick<ScanPoint, 'i' | 'j' | 'xc' | 'xd' | 'qc' | 'qd' | 'pc' | 'pd'>,
  withinLimits = true,
): ScanPoint {
  const valid = f.dropletDiameter.valid && f.frequency.valid
  const point: ScanPoint = {
    i: at.i,
    j: at.j,
    xc: at.xc,
    xd: at.xd,
    qc: at.qc,
    qd: at.qd,
    diameter: f.dropletDiameter,
    frequency: f.frequency,
    regime: f.regime.value,
    valid,
    withinLimits,
    hit: hitsTarget(f.dropletDiameter.value, f.frequency.value, target),
  }
  if (at.pc !== undefined) point.pc = at.pc
  if (at.pd !== undefined) point.pd = at.pd
  const why = whyInvalid(f)
  if (why) point.why = why
  return point
}

/** One forecast of `j` at flows qc, qd (m³/s). */
export function forecastAt(j: ResolvedJunction, qc: number, qd: number, warnings: Warning[] = []): JunctionForecast {
  return forecastJunction({ ...j, flowContinuous: qc, flowDispersed: qd }, warnings)
}

/** Scans an n × n grid of flows (log-spaced) over [qcLo, qcHi] × [qdLo, qdHi]. */
export function scanJunction(
  j: ResolvedJunction,
  box: { continuous: [number, number]; dispersed: [number, number] },
  n: number,
  target: PlanTarget,
): Scan {
  const qcs = logSpace(box.continuous[0], box.continuous[1], n)
  const qds = logSpace(box.dispersed[0], box.dispersed[1], n)
  const points: ScanPoint[] = []
  // One junction object, its flows set per point: the core reads it and keeps none of it (a copy per point cost
  // about a tenth of the scan).
  const probe: ResolvedJunction = { ...j }
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      const qc = qcs[i]!
      const qd = qds[k]!
      probe.flowContinuous = qc
      probe.flowDispersed = qd
      points.push(pointFromForecast(forecastJunction(probe), target, { i, j: k, xc: qc, xd: qd, qc, qd }))
    }
  }
  return {
    continuous: { phase: 'continuous', mode: 'flow', unit: UNIT.flow, values: qcs },
    dispersed: { phase: 'dispersed', mode: 'flow', unit: UNIT.flow, values: qds },
    points,
  }
}
