// Sweeps of one junction's operating point for the plots: droplet size against flow-rate ratio (dispersed flow
// varied, continuous held) and against capillary number (both flows scaled together), and a regime map over
// both. Each point is the same junction forecast the document uses (shared/physics), with the junction's own
// geometry, liquids and tension; only the two flows change.
import { forecastJunction } from '../physics/forecast/junction'
import type { JunctionForecast, ResolvedJunction } from '../physics/forecast/types'

export interface SweepPoint {
  x: number
  diameterUm: number
  regime: string
  valid: boolean
}

/** The forecast's own inputs, back in resolved form, so a sweep varies only the flows. */
export function resolvedFrom(f: JunctionForecast): ResolvedJunction {
  const i = f.inputs
  return {
    kind: i.junction.kind,
    mainWidth: i.junction.mainWidth.value,
    inletWidth: i.junction.inletWidth.value,
    depth: i.junction.depth.value,
    continuous: i.continuous,
    dispersed: i.dispersed,
    interfacialTension: i.interfacialTension,
    temperature: i.temperature.value,
    flowContinuous: i.flow.continuous.value,
    flowDispersed: i.flow.dispersed.value,
    ...(i.contactAngle ? { contactAngle: i.contactAngle.value } : {}),
    ...(i.model.alpha !== undefined ? { alpha: i.model.alpha } : {}),
  }
}

/** `n` values spaced evenly in log between lo and hi. */
export const logSpace = (lo: number, hi: number, n: number): number[] =>
  Array.from({ length: n }, (_, k) => lo * (hi / lo) ** (n === 1 ? 0 : k / (n - 1)))

function point(j: ResolvedJunction, x: (f: JunctionForecast) => number): SweepPoint | null {
  try {
    const f = forecastJunction(j)
    return {
      x: x(f),
      diameterUm: f.dropletDiameter.value * 1e6,
      regime: f.regime.value,
      valid: f.dropletDiameter.valid && f.regime.valid,
    }
  } catch {
    return null
  }
}

/** Diameter against flow-rate ratio φ = Qd/Qc, from φ/10 to 10·φ around the current point. */
export function sweepFlowRatio(f: JunctionForecast, n = 24): SweepPoint[] {
  const j = resolvedFrom(f)
  const phi = j.flowDispersed / j.flowContinuous
  return logSpace(phi / 10, phi * 10, n).flatMap(
    r => point({ ...j, flowDispersed: r * j.flowContinuous }, g => g.flowRateRatio.value) ?? [],
  )
}

/** Diameter against capillary number: both flows scaled from ×0.05 to ×20, the ratio held. */
export function sweepCapillary(f: JunctionForecast, n = 24): SweepPoint[] {
  const j = resolvedFrom(f)
  return logSpace(0.05, 20, n).flatMap(
    k =>
      point(
        { ...j, flowContinuous: k * j.flowContinuous, flowDispersed: k * j.flowDispersed },
        g => g.capillaryNumber.value,
      ) ?? [],
  )
}

export interface RegimeCell {
  ca: number
  phi: number
  regime: string
}

/** The regime over a grid of capillary number (flows scaled) × flow-rate ratio around the current point. */
export function regimeMap(f: JunctionForecast, n = 14): RegimeCell[] {
  const j = resolvedFrom(f)
  const phi = j.flowDispersed / j.flowContinuous
  const cells: RegimeCell[] = []
  for (const k of logSpace(0.02, 50, n)) {
    for (const r of logSpace(phi / 20, phi * 20, n)) {
      const qc = k * j.flowContinuous
      try {
        const g = forecastJunction({ ...j, flowContinuous: qc, flowDispersed: r * qc })
        cells.push({ ca: g.capillaryNumber.value, phi: g.flowRateRatio.value, regime: g.regime.value })
      } catch {
        /* a point the method cannot take is left blank */
      }
    }
  }
  return cells
}
