// A sample's count, mean, standard deviation and coefficient of variation.

export interface SampleSummary {
  count: number
  mean: number
  /** Sample standard deviation (n − 1 in the denominator); 0 for a single value. */
  sd: number
  /** sd / mean: the monodispersity of a droplet population (below 3 % is the usual bar, common practice, no source). */
  cv: number
  min: number
  max: number
}

/**
 * Mean and sample standard deviation by Welford's one-pass update (Welford 1962, Technometrics 4, 419), which keeps
 * its accuracy where the two-pass textbook sum of squares loses digits (Chan, Golub & LeVeque 1983, Am. Stat. 37, 242).
 */
export function describeSample(values: readonly number[]): SampleSummary {
  if (values.length === 0) throw new RangeError('A sample needs at least one value')
  let mean = 0
  let m2 = 0
  let min = Infinity
  let max = -Infinity
  values.forEach((v, i) => {
    if (!Number.isFinite(v)) throw new RangeError(`Value ${i + 1} is not a finite number (got ${v})`)
    const delta = v - mean
    mean += delta / (i + 1)
    m2 += delta * (v - mean)
    min = Math.min(min, v)
    max = Math.max(max, v)
  })
  const sd = values.length > 1 ? Math.sqrt(m2 / (values.length - 1)) : 0
  return { count: values.length, mean, sd, cv: mean !== 0 ? sd / mean : 0, min, max }
}

/** Monodisperse by the common bar (CV below 3 %; common practice, no source). */
export const MONODISPERSE_CV = 0.03
