// From a scan to the answered window: points as quantities, contours of the target size and the minimum rate,
// counts per regime; and the recommended point (or why there is none).
import { quantity, type Method, type Quantity } from '../quantity'
import { UNIT } from '../units'
import { bisectLog } from './grid'
import type { Contour, PlanTarget, PlanWindow, Recommended, Scan, ScanPoint, Unreachable, WindowPoint } from './types'

export const GRID: Method = {
  id: 'planner-grid',
  source: "operating point of the planner's scan (log-spaced flows, evenly spaced pressures)",
}
export const CONTOUR: Method = {
  id: 'planner-contour',
  source: 'level line of the scanned forecast, interpolated linearly in log(axis) between grid points',
}

/** Recomputes one point at axis values (xc, xd): the scan's own forecast, for refining the recommendation. */
export type Evaluate = (xc: number, xd: number) => ScanPoint

export function windowPoint(p: ScanPoint): WindowPoint {
  const point: WindowPoint = {
    flow: { continuous: quantity(p.qc, UNIT.flow, GRID), dispersed: quantity(p.qd, UNIT.flow, GRID) },
    dropletDiameter: p.diameter,
    frequency: p.frequency,
    regime: p.regime,
    valid: p.valid,
    withinLimits: p.withinLimits,
    hit: p.hit,
  }
  if (p.pc !== undefined || p.pd !== undefined) {
    point.pressure = {
      continuous: quantity(p.pc ?? 0, UNIT.pressure, GRID, p.pc !== undefined),
      dispersed: quantity(p.pd ?? 0, UNIT.pressure, GRID, p.pd !== undefined),
    }
  }
  return point
}

function contour(
  scan: Scan,
  name: Contour['name'],
  level: number,
  unit: string,
  value: (p: ScanPoint) => number | null,
): Contour {
  const n = scan.dispersed.values.length
  const line: [number, number][] = []
  const byIndex = new Map(scan.points.map(p => [p.i * n + p.j, p]))
  scan.continuous.values.forEach((xc, i) => {
    for (let k = 0; k + 1 < n; k++) {
      const a = byIndex.get(i * n + k)
      const b = byIndex.get(i * n + k + 1)
      const va = a && value(a)
      const vb = b && value(b)
      if (va == null || vb == null || (va - level) * (vb - level) > 0 || va === vb) continue
      const t = (level - va) / (vb - va)
      const x0 = scan.dispersed.values[k]!
      const x1 = scan.dispersed.values[k + 1]!
      const xd = x0 > 0 ? Math.exp(Math.log(x0) + t * (Math.log(x1) - Math.log(x0))) : x0 + t * (x1 - x0)
      line.push([xc, xd])
      break
    }
  })
  return { name, level: quantity(level, unit, CONTOUR), points: line }
}

export function buildWindow(scan: Scan, target: PlanTarget): PlanWindow {
  const regimes: Record<string, number> = {}
  let valid = 0
  let hits = 0
  let validHits = 0
  for (const p of scan.points) {
    regimes[p.regime] = (regimes[p.regime] ?? 0) + 1
    if (p.valid) valid++
    if (p.hit) hits++
    if (p.hit && p.valid) validHits++
  }
  const d = (p: ScanPoint) => p.diameter?.value ?? null
  const contours = [
    contour(scan, 'target-diameter', target.diameter, UNIT.length, d),
    contour(scan, 'diameter-low', target.diameter * (1 - target.tolerance), UNIT.length, d),
    contour(scan, 'diameter-high', target.diameter * (1 + target.tolerance), UNIT.length, d),
  ]
  if (target.minFrequency !== undefined)
    contours.push(contour(scan, 'min-frequency', target.minFrequency, UNIT.frequency, p => p.frequency?.value ?? null))
  const window: PlanWindow = {
    mode: { continuous: scan.continuous.mode, dispersed: scan.dispersed.mode },
    axes: { continuous: scan.continuous, dispersed: scan.dispersed },
    points: scan.points.map(windowPoint),
    contours,
    counts: { points: scan.points.length, valid, hits, validHits, regimes },
  }
  if (scan.junctionId) window.junction = scan.junctionId
  return window
}

const um = (m: number) => `${(m * 1e6).toPrecision(3)} µm`
const hz = (f: number) => (f >= 1000 ? `${(f / 1000).toPrecision(3)} kHz` : `${f.toPrecision(3)} Hz`)
const rate = (p: ScanPoint) => p.frequency?.value ?? 0
/** Order of preference among points outside validity (common practice, no source): the law's own regime first. */
const FALLBACK_RANK: Record<string, number> = { squeezing: 0, 'step-emulsification': 0, transition: 1, dripping: 2 }

/** Tunes the dispersed axis at the point's continuous value so the size sits on the target (bisection between its neighbours). */
function refine(scan: Scan, best: ScanPoint, target: PlanTarget, evaluate: Evaluate): ScanPoint {
  const xs = scan.dispersed.values
  const xc = scan.continuous.values[best.i]!
  // Already on the target (a step's size hardly depends on flow): nothing to tune.
  if (best.diameter && Math.abs(best.diameter.value - target.diameter) <= 1e-3 * target.diameter) return best
  const lo = xs[Math.max(0, best.j - 1)]!
  const hi = xs[Math.min(xs.length - 1, best.j + 1)]!
  if (!(lo > 0)) return best
  const x = bisectLog(v => evaluate(xc, v).diameter?.value ?? null, lo, hi, target.diameter, 30)
  if (x === null) return best
  const tuned = { ...evaluate(xc, x), i: best.i, j: best.j }
  // Tuning must not move the point into another regime or out of validity (the scan's point stays otherwise).
  return tuned.hit && tuned.withinLimits && tuned.regime === best.regime && (tuned.valid || !best.valid) ? tuned : best
}

export function recommend(
  scan: Scan,
  target: PlanTarget,
  evaluate: Evaluate,
  limitsChecked: boolean,
): { recommended: Recommended | null; unreachable?: Unreachable; point?: ScanPoint } {
  const tol = `${um(target.diameter)} ± ${(target.tolerance * 100).toPrecision(2)} %`
  const rateText = target.minFrequency !== undefined ? ` at ≥ ${hz(target.minFrequency)}` : ''
  const limits = limitsChecked ? " and the pump's and bond's pressure limits" : ''
  const pick = (ps: ScanPoint[]) => ps.reduce<ScanPoint | null>((a, p) => (!a || rate(p) > rate(a) ? p : a), null)
  const validHits = scan.points.filter(p => p.hit && p.valid && p.withinLimits)
  const best = pick(validHits)
  if (best) {
    const tuned = refine(scan, best, target, evaluate)
    return {
      point: tuned,
      recommended: {
        ...windowPoint(tuned),
        reason: `Highest droplet rate (${hz(rate(tuned))}) of the ${validHits.length} scanned points that give ${tol}${rateText} inside the methods' validity${limits}${tuned === best ? '' : `; the dispersed ${scan.dispersed.mode} is tuned to put the size on the target`}.`,
      },
    }
  }
  // Outside validity, prefer the regimes whose law is closest to applying, never jetting or strong inertia.
  const invalidHits = scan.points.filter(
    p => p.hit && p.withinLimits && p.regime !== 'jetting' && p.why !== 'inertia' && p.why !== 'jetting',
  )
  const rank = (p: ScanPoint) => FALLBACK_RANK[p.regime] ?? 9
  const bestRank = Math.min(...invalidHits.map(rank))
  const fallback = pick(invalidHits.filter(p => rank(p) === bestRank))
  if (fallback) {
    const tuned = refine(scan, fallback, target, evaluate)
    const why = tuned.why ? ` (the forecast says "${tuned.why}")` : ''
    return {
      point: tuned,
      recommended: {
        ...windowPoint(tuned),
        reason: `No scanned point gives ${tol}${rateText} inside the methods' validity${why}; this is the highest-rate point that reaches the target outside it, so treat its size as an estimate: calibrate with measured droplets or use the suggested geometry, whose law is valid there.`,
      },
    }
  }
  return { recommended: null, unreachable: explain(scan, target, tol, rateText) }
}

function explain(scan: Scan, target: PlanTarget, tol: string, rateText: string): Unreachable {
  const sized = scan.points.filter(p => p.diameter)
  if (!sized.length) {
    const why = scan.points.find(p => p.why)?.why
    return {
      reason: `The junction makes no drops anywhere in the searched range${why ? ` ("${why}")` : ''}: widen the search range or check the liquids and the inlets.`,
      nearest: null,
      reachable: null,
    }
  }
  const pool = sized.some(p => p.valid) ? sized.filter(p => p.valid) : sized
  const dia = (p: ScanPoint) => p.diameter!.value
  const smallest = pool.reduce((a, p) => (dia(p) < dia(a) ? p : a))
  const largest = pool.reduce((a, p) => (dia(p) > dia(a) ? p : a))
  const nearest = pool.reduce((a, p) =>
    Math.abs(dia(p) - target.diameter) < Math.abs(dia(a) - target.diameter) ? p : a,
  )
  const scope =
    pool === sized
      ? "in the searched range (no point is inside the size law's validity)"
      : "inside the methods' validity in the searched range"
  let reason: string
  if (target.diameter * (1 + target.tolerance) < dia(smallest)) {
    reason = `A ${tol} drop is smaller than any this junction makes ${scope}: the smallest is ${um(dia(smallest))}. The channel sets the size (a confined drop is at least about as wide as its channel): use a narrower or shallower junction (see geometry).`
  } else if (target.diameter * (1 - target.tolerance) > dia(largest)) {
    reason = `A ${tol} drop is larger than any this junction makes ${scope}: the largest is ${um(dia(largest))}. Use a wider or deeper junction (see geometry), or widen the search range.`
  } else {
    const sizeHits = scan.points.filter(
      p => p.diameter && Math.abs(dia(p) - target.diameter) <= target.tolerance * target.diameter,
    )
    const withinLimits = sizeHits.filter(p => p.withinLimits)
    const fastest = withinLimits.reduce<ScanPoint | null>((a, p) => (!a || rate(p) > rate(a) ? p : a), null)
    reason = !withinLimits.length
      ? `Drops of ${tol} form only at points above the pump's or the bond's pressure limit: lower the channel resistance or raise the limits if the chip allows.`
      : `Drops of ${tol} form here only up to ${hz(rate(fastest!))}, below the wanted rate${rateText}: widen the flow range or run several junctions in parallel (see geometry).`
  }
  return {
    reason,
    nearest: { dropletDiameter: nearest.diameter!, point: windowPoint(nearest) },
    reachable: { smallest: smallest.diameter!, largest: largest.diameter! },
  }
}

/** The size quantity of the target, for the answer. */
export function targetQuantities(target: PlanTarget): {
  dropletDiameter: Quantity
  dropletVolume: Quantity
  tolerance: number
  minFrequency?: Quantity
} {
  const input: Method = { id: 'input', source: 'given in the request (diameter ↔ volume of the equal-volume sphere)' }
  const answer: ReturnType<typeof targetQuantities> = {
    dropletDiameter: quantity(target.diameter, UNIT.length, input),
    dropletVolume: quantity(target.volume, UNIT.volume, input),
    tolerance: target.tolerance,
  }
  if (target.minFrequency !== undefined) answer.minFrequency = quantity(target.minFrequency, UNIT.frequency, input)
  return answer
}
