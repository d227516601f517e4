// Digital assays: the concentration from the share of positive partitions, its confidence interval, the
// dynamic range of a partition count and volume, and the precision against concentration.
import { quantity, type Method, type Quantity } from '../quantity'
import { UNIT } from '../units'

export const DUBE_ESTIMATE: Method = {
  id: 'dube-2008-poisson-estimate',
  source:
    'λ = −ln(1 − p), p = k/n positive partitions, c = λ/V; confidence interval from the binomial interval of p, ' +
    'p ± z √(p(1 − p)/n), carried through −ln(1 − p) (Dube, Qin & Ramakrishnan 2008, PLoS ONE 3, e2876, eqs. for the ' +
    'estimated number of molecules and its confidence interval)',
}
export const DYNAMIC_RANGE: Method = {
  id: 'digital-dynamic-range',
  source:
    'from one positive, λ = −ln(1 − 1/n), to one negative, λ = ln n, of n partitions (Dube et al. 2008, PLoS ONE 3, e2876; Majumdar, Wessel & Marks 2015, PLoS ONE 10, e0118833)',
}
export const PRECISION: Method = {
  id: 'digital-relative-precision',
  source:
    'relative half-width z √((e^λ − 1)/n) / λ, the delta-method standard error of λ̂ = −ln(1 − p̂) (Dube et al. 2008, PLoS ONE 3, e2876); ' +
    'best near λ ≈ 1.59 (Majumdar, Wessel & Marks 2015, PLoS ONE 10, e0118833)',
}

/** Two-sided standard normal quantile (Acklam's rational approximation, relative error < 1.15e-9; from memory). */
export function normalQuantile(p: number): number {
  const a = [
    -39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716, 2.506628277459239,
  ]
  const b = [-54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572]
  const c = [
    -0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968,
    2.938163982698783,
  ]
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416]
  const low = 0.02425
  if (p < low) {
    const q = Math.sqrt(-2 * Math.log(p))
    return (
      (((((c[0]! * q + c[1]!) * q + c[2]!) * q + c[3]!) * q + c[4]!) * q + c[5]!) /
      ((((d[0]! * q + d[1]!) * q + d[2]!) * q + d[3]!) * q + 1)
    )
  }
  if (p > 1 - low) return -normalQuantile(1 - p)
  const q = p - 0.5
  const r = q * q
  return (
    ((((((a[0]! * r + a[1]!) * r + a[2]!) * r + a[3]!) * r + a[4]!) * r + a[5]!) * q) /
    (((((b[0]! * r + b[1]!) * r + b[2]!) * r + b[3]!) * r + b[4]!) * r + 1)
  )
}

export interface DubeEstimate {
  p: number
  lambda: number
  lambdaLow: number
  lambdaHigh: number
  /** Estimated molecules in the n partitions, n λ, and its interval. */
  molecules: number
  moleculesLow: number
  moleculesHigh: number
}

/** Dube et al. 2008: λ̂ and its interval from k positives of n at two-sided `confidence`. */
export function dubeEstimate(k: number, n: number, confidence = 0.95): DubeEstimate {
  const z = normalQuantile(1 - (1 - confidence) / 2)
  const p = k / n
  const half = z * Math.sqrt((p * (1 - p)) / n)
  const lam = (x: number) => -Math.log1p(-Math.min(Math.max(x, 0), 1 - 1e-15))
  const lambda = lam(p)
  const lambdaLow = lam(p - half)
  const lambdaHigh = lam(p + half)
  return {
    p,
    lambda,
    lambdaLow,
    lambdaHigh,
    molecules: n * lambda,
    moleculesLow: n * lambdaLow,
    moleculesHigh: n * lambdaHigh,
  }
}

/** Relative half-width of the interval at mean occupancy λ with n partitions. */
export function relativePrecision(lambda: number, n: number, confidence = 0.95): number {
  const z = normalQuantile(1 - (1 - confidence) / 2)
  return (z * Math.sqrt(Math.expm1(lambda) / n)) / lambda
}

export interface DigitalAssay {
  partitions: number
  partitionVolume: Quantity
  confidence: number
  dynamicRange: { lowest: Quantity; highest: Quantity; lambdaLowest: Quantity; lambdaHighest: Quantity }
  /** Relative half-width of the interval against concentration, for the plot. */
  precision: { concentration: Quantity; lambda: number; relativeHalfWidth: Quantity }[]
  /** When positives are given: the estimate and its interval. */
  estimate?: {
    positives: number
    lambda: Quantity
    concentration: Quantity
    low: Quantity
    high: Quantity
    molecules: Quantity
  }
}

/** The digital assay of `n` partitions of `volume` m³ (and k positives when given). */
export function digitalAssay(n: number, volume: number, k?: number, confidence = 0.95): DigitalAssay {
  const perM3 = 'm^-3'
  const lambdaLowest = -Math.log1p(-1 / n)
  const lambdaHighest = Math.log(n)
  const precision: DigitalAssay['precision'] = []
  const steps = 40
  for (let s = 0; s <= steps; s++) {
    const lambda = Math.exp(Math.log(lambdaLowest) + ((Math.log(lambdaHighest) - Math.log(lambdaLowest)) * s) / steps)
    precision.push({
      concentration: quantity(lambda / volume, perM3, PRECISION),
      lambda,
      relativeHalfWidth: quantity(relativePrecision(lambda, n, confidence), UNIT.none, PRECISION),
    })
  }
  const answer: DigitalAssay = {
    partitions: n,
    partitionVolume: quantity(volume, UNIT.volume, {
      id: 'planned-droplet-volume',
      source: 'the droplet volume of the recommended point (or the target when none)',
    }),
    confidence,
    dynamicRange: {
      lowest: quantity(lambdaLowest / volume, perM3, DYNAMIC_RANGE),
      highest: quantity(lambdaHighest / volume, perM3, DYNAMIC_RANGE),
      lambdaLowest: quantity(lambdaLowest, UNIT.none, DYNAMIC_RANGE),
      lambdaHighest: quantity(lambdaHighest, UNIT.none, DYNAMIC_RANGE),
    },
    precision,
  }
  if (k !== undefined) {
    const e = dubeEstimate(k, n, confidence)
    // All or none positive: the estimate is a bound, not a value (marked invalid).
    const valid = k > 0 && k < n
    answer.estimate = {
      positives: k,
      lambda: quantity(Math.min(e.lambda, 745), UNIT.none, DUBE_ESTIMATE, valid),
      concentration: quantity(Math.min(e.lambda, 745) / volume, perM3, DUBE_ESTIMATE, valid),
      low: quantity(e.lambdaLow / volume, perM3, DUBE_ESTIMATE, valid),
      high: quantity(Math.min(e.lambdaHigh, 745) / volume, perM3, DUBE_ESTIMATE, valid),
      molecules: quantity(n * Math.min(e.lambda, 745), UNIT.none, DUBE_ESTIMATE, valid),
    }
  }
  return answer
}
