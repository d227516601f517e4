// Axis values of a window scan.

/** n values from lo to hi, evenly spaced in log (flows span decades). */
export function logSpace(lo: number, hi: number, n: number): number[] {
  const a = Math.log(lo)
  const step = (Math.log(hi) - a) / (n - 1)
  return Array.from({ length: n }, (_, k) => (k === n - 1 ? hi : Math.exp(a + step * k)))
}

/** n values from lo to hi, evenly spaced (pressures of a controller). */
export function linSpace(lo: number, hi: number, n: number): number[] {
  const step = (hi - lo) / (n - 1)
  return Array.from({ length: n }, (_, k) => (k === n - 1 ? hi : lo + step * k))
}

/** Where `f` crosses `level` between a and b, by bisection in log space (f continuous and monotone there). */
export function bisectLog(
  f: (x: number) => number | null,
  a: number,
  b: number,
  level: number,
  steps = 40,
): number | null {
  let fa = f(a)
  const fb = f(b)
  if (fa === null || fb === null || (fa - level) * (fb - level) > 0) return null
  let lo = Math.log(a)
  let hi = Math.log(b)
  for (let s = 0; s < steps; s++) {
    const mid = (lo + hi) / 2
    const fm = f(Math.exp(mid))
    if (fm === null) return null
    if ((fm - level) * (fa - level) <= 0) hi = mid
    else {
      lo = mid
      fa = fm
    }
  }
  return Math.exp((lo + hi) / 2)
}
