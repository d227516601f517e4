// Calibration from measured droplets: the squeezing coefficient α, or a lab correction factor, by least squares.
import type { Method } from '../quantity'
import { plugLength, sphereVolume } from '../junction/plugVolume'
import type { Metres } from '../units'
import { tQuantile975 } from './student'

export const LEAST_SQUARES: Method = {
  id: 'least-squares-through-origin',
  source:
    'linear least squares through the origin, standard error s/√Σx², 95 % interval with Student t (Montgomery & Runger 2014, Applied Statistics and Probability for Engineers, sec. 11.4)',
}

export interface Fit {
  value: number
  standardError: number
  interval95: [number, number]
  points: number
  method: string
  source: string
}

/** Fits y = k x through the origin. Needs two points or more, with some x ≠ 0. */
export function fitThroughOrigin(x: readonly number[], y: readonly number[]): Fit {
  const n = x.length
  if (n < 2 || y.length !== n)
    throw new RangeError(
      `Calibration needs at least two (x, y) points of equal count (got ${n} and ${y.length}); measure at two or more flow ratios`,
    )
  let sxx = 0
  let sxy = 0
  for (let i = 0; i < n; i++) ((sxx += x[i]! * x[i]!), (sxy += x[i]! * y[i]!))
  if (!(sxx > 0)) throw new RangeError('Calibration points all have x = 0; measure at non-zero flow ratios')
  const k = sxy / sxx
  let rss = 0
  for (let i = 0; i < n; i++) rss += (y[i]! - k * x[i]!) ** 2
  const standardError = Math.sqrt(rss / (n - 1) / sxx)
  const half = tQuantile975(n - 1) * standardError
  return {
    value: k,
    standardError,
    interval95: [k - half, k + half],
    points: n,
    method: LEAST_SQUARES.id,
    source: LEAST_SQUARES.source,
  }
}

export interface DropletPoint {
  /** Qd/Qc. */
  flowRatio: number
  /** Measured plug length L, m — or a sphere-equivalent diameter, m. */
  length?: number
  diameter?: number
}

/**
 * α of L/w = 1 + α Qd/Qc (Garstecki et al. 2006) from measured plugs: y = L/w − 1 against x = Qd/Qc.
 * A measured diameter is turned into a length through the confined-plug volume (Musterd et al. 2015).
 */
export function fitSqueezingAlpha(points: readonly DropletPoint[], width: Metres, depth: Metres): Fit {
  const x: number[] = []
  const y: number[] = []
  points.forEach((point, i) => {
    const length =
      point.length ??
      (point.diameter !== undefined ? plugLength(sphereVolume(point.diameter as Metres), width, depth) : undefined)
    if (length === undefined || !(length > 0) || !(point.flowRatio > 0))
      throw new RangeError(`Calibration point ${i} needs flowRatio > 0 and a length or diameter > 0`)
    x.push(point.flowRatio)
    y.push(length / width - 1)
  })
  return fitThroughOrigin(x, y)
}

/** Lab correction factor k with measured ≈ k × predicted. */
export function fitCorrectionFactor(predicted: readonly number[], measured: readonly number[]): Fit {
  return fitThroughOrigin(predicted, measured)
}
