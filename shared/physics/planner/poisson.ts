// Loading of cells or beads into droplets: Poisson occupancy from the concentration and the droplet volume.
import { quantity, type Method, type Quantity } from '../quantity'
import { UNIT } from '../units'

export const POISSON_LOADING: Method = {
  id: 'poisson-loading',
  source:
    'P(k) = λ^k e^−λ / k!, λ = c V: random (Poisson) loading of cells or beads into drops of volume V from a suspension of ' +
    'concentration c (Collins, Neild, deMello, Liu & Ai 2015, Lab Chip 15, 3439, sec. 2; author list from memory). Holds when ' +
    'cells arrive independently (no ordering, no settling or clumping)',
}
export const POISSON_RATE: Method = {
  id: 'poisson-loading-rate',
  source:
    'cells per hour = λ f · 3600 s/h = c Qd · 3600 s/h, continuity of the loaded liquid (Collins et al. 2015, Lab Chip 15, 3439)',
}
export const POISSON_INVERSE: Method = {
  id: 'poisson-concentration-for-lambda',
  source: 'c = λ / V, the loading law solved for c (Collins et al. 2015, Lab Chip 15, 3439)',
}

/** Common practice, no source: λ ≈ 0.1 keeps doubly loaded drops below ~0.5 % at the price of ~90 % empty ones. */
export const DEFAULT_TARGET_LAMBDA = 0.1

export interface Occupancy {
  empty: number
  single: number
  multiple: number
}

/** P(0), P(1) and P(k ≥ 2) for mean λ (closed form; 1 − e^−λ(1 + λ) computed without cancellation for small λ). */
export function occupancy(lambda: number): Occupancy {
  const empty = Math.exp(-lambda)
  const single = lambda * empty
  // 1 − e^−λ(1 + λ) = −expm1(−λ) − λ e^−λ; for small λ use the series λ²/2 − λ³/3 + λ⁴/8 to keep its digits.
  const multiple = lambda < 1e-3 ? lambda ** 2 / 2 - lambda ** 3 / 3 + lambda ** 4 / 8 : -Math.expm1(-lambda) - single
  return { empty, single, multiple: Math.max(0, multiple) }
}

/** P(k) for k = 0…kMax (for the occupancy bars). */
export function poissonPmf(lambda: number, kMax: number): number[] {
  const out: number[] = []
  let p = Math.exp(-lambda)
  for (let k = 0; k <= kMax; k++) {
    out.push(p)
    p *= lambda / (k + 1)
  }
  return out
}

export interface Encapsulation {
  concentration: Quantity
  dropletVolume: Quantity
  lambda: Quantity
  empty: Quantity
  single: Quantity
  multiple: Quantity
  /** Of the loaded drops, the share with exactly one cell: P(1) / (1 − P(0)). */
  singleAmongLoaded: Quantity
  /** P(k), k = 0…5, for the bars. */
  distribution: { k: number; probability: Quantity }[]
  cellsPerHour?: Quantity
  singleDropletsPerHour?: Quantity
  targetLambda: number
  concentrationForTarget: Quantity
}

/** Loading of drops of `volume` (m³) at `frequency` (Hz, optional) from `concentration` (per m³). */
export function encapsulation(
  concentration: number,
  volume: number,
  frequency?: number,
  targetLambda = DEFAULT_TARGET_LAMBDA,
  valid = true,
): Encapsulation {
  const lambda = concentration * volume
  const o = occupancy(lambda)
  const q = (value: number, unit: string = UNIT.none, method: Method = POISSON_LOADING) =>
    quantity(value, unit, method, valid)
  const answer: Encapsulation = {
    concentration: quantity(concentration, 'm^-3', { id: 'input', source: 'given in the request' }),
    dropletVolume: q(volume, UNIT.volume, {
      id: 'planned-droplet-volume',
      source: 'the droplet volume of the recommended point (or the target when none)',
    }),
    lambda: q(lambda),
    empty: q(o.empty),
    single: q(o.single),
    multiple: q(o.multiple),
    singleAmongLoaded: q(lambda > 0 ? o.single / -Math.expm1(-lambda) : 1),
    distribution: poissonPmf(lambda, 5).map((p, k) => ({ k, probability: q(p) })),
    targetLambda,
    concentrationForTarget: q(targetLambda / volume, 'm^-3', POISSON_INVERSE),
  }
  if (frequency !== undefined) {
    answer.cellsPerHour = q(lambda * frequency * 3600, '1/h', POISSON_RATE)
    answer.singleDropletsPerHour = q(o.single * frequency * 3600, '1/h', POISSON_RATE)
  }
  return answer
}
