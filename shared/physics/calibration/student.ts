// Two-sided 95 % quantile of Student's t distribution.
// Table values t(0.975, ν) for ν = 1..30, standard statistical tables (e.g. Montgomery & Runger 2014, Table V).
const TABLE = [
  12.706, 4.303, 3.182, 2.776, 2.571, 2.447, 2.365, 2.306, 2.262, 2.228, 2.201, 2.179, 2.16, 2.145, 2.131, 2.12, 2.11,
  2.101, 2.093, 2.086, 2.08, 2.074, 2.069, 2.064, 2.06, 2.056, 2.052, 2.048, 2.045, 2.042,
]

/** Beyond ν = 30: Cornish–Fisher expansion about z = 1.959964 (Abramowitz & Stegun 1964, eq. 26.7.5). */
export function tQuantile975(degrees: number): number {
  if (degrees < 1) throw new RangeError('Student t needs at least one degree of freedom')
  if (degrees <= 30) return TABLE[Math.floor(degrees) - 1]!
  const z = 1.959964
  const g1 = (z ** 3 + z) / 4
  const g2 = (5 * z ** 5 + 16 * z ** 3 + 3 * z) / 96
  return z + g1 / degrees + g2 / degrees ** 2
}
