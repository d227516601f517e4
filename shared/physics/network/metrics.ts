// Pressure budget and flow uniformity read off a solved network.

export interface Uniformity {
  /** Coefficient of variation, population standard deviation / mean, of the flows. */
  cv: number
  maxOverMin: number
  mean: number
  count: number
}

/** Flow uniformity across a set of nominally parallel channels (magnitudes of their flows). */
export function flowUniformity(flows: readonly number[]): Uniformity {
  const values = flows.map(Math.abs)
  const count = values.length
  const mean = values.reduce((a, b) => a + b, 0) / count
  const variance = values.reduce((a, b) => a + (b - mean) ** 2, 0) / count
  const min = Math.min(...values)
  const max = Math.max(...values)
  return {
    cv: mean > 0 ? Math.sqrt(variance) / mean : 0,
    maxOverMin: min > 0 ? max / min : Number.POSITIVE_INFINITY,
    mean,
    count,
  }
}

export interface Margin {
  limit: number
  highest: number
  /** limit − highest inlet pressure, Pa; negative means over the limit. */
  margin: number
  /** highest / limit. */
  utilisation: number
  ok: boolean
}

export function pressureMargin(limit: number, inletPressures: readonly number[]): Margin {
  const highest = Math.max(0, ...inletPressures)
  return { limit, highest, margin: limit - highest, utilisation: highest / limit, ok: highest <= limit }
}

/**
 * A pump's margin counts suction as well as pressure: a source that must pull −30 kPa uses 30 kPa of a pump
 * rated for ±X. (A bond only feels overpressure, so the bond margin keeps pressureMargin.)
 */
export function pumpMargin(limit: number, inletPressures: readonly number[]): Margin {
  return pressureMargin(limit, inletPressures.map(Math.abs))
}

/** Gauge pressure of a perfect vacuum at standard atmosphere, Pa (101 325 Pa, ISO 2533). */
export const VACUUM_GAUGE = -101_325

/** A source that would need more suction than a vacuum gives cannot be run; say so. */
export function suctionWarnings(
  inlets: readonly { pressure: { value: number }; node: string; port?: string }[],
): { code: string; message: string }[] {
  return inlets
    .filter(inlet => inlet.pressure.value < VACUUM_GAUGE)
    .map(inlet => ({
      code: 'suction-beyond-vacuum',
      message: `Inlet "${inlet.port ?? inlet.node}" would need ${(inlet.pressure.value / 100).toPrecision(4)} mbar gauge, more suction than a perfect vacuum (−1013 mbar): this operating point cannot be run — lower its flow`,
    }))
}
