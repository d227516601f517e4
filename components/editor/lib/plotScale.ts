// Log-log axes for the small forecast plots (SVG user units); pure.
export interface LogAxis { lo: number; hi: number; px0: number; px1: number }

export const logPos = (a: LogAxis, v: number): number =>
  a.px0 + ((Math.log10(v) - Math.log10(a.lo)) / (Math.log10(a.hi) - Math.log10(a.lo))) * (a.px1 - a.px0)

/** Bounds of positive values, widened a little so points do not sit on the frame. */
export function logBounds(values: number[]): { lo: number; hi: number } {
  const v = values.filter((x) => x > 0 && Number.isFinite(x))
  if (!v.length) return { lo: 0.1, hi: 10 }
  const lo = Math.min(...v) / 1.15
  const hi = Math.max(...v) * 1.15
  return hi / lo < 1.5 ? { lo: lo / 1.5, hi: hi * 1.5 } : { lo, hi }
}

export const decadeTicks = (lo: number, hi: number): number[] => {
  const out: number[] = []
  for (let e = Math.ceil(Math.log10(lo)); e <= Math.floor(Math.log10(hi)); e++) out.push(10 ** e)
  return out
}

export const tickLabel = (v: number): string => (v >= 1e-2 && v < 1e4 ? String(Number(v.toPrecision(2))) : v.toExponential(0))
