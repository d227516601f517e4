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
  return { cv: mean > 0 ? Math.sqrt(variance) / mean : 0, maxOverMin: min > 0 ? max / min : Number.POSITIVE_INFINITY, mean, count }
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
