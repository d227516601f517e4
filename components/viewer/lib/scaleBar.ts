// Scale bar and length formatting. Lengths come in µm; the bar picks the longest "nice" length (1, 2 or 5 times
// a power of ten) that fits, so it reads 100 µm, 200 µm, 500 µm, 1 mm, 2 mm …

export interface ScaleBar {
  lengthUm: number
  label: string
  px: number
}

const STEPS = [1, 2, 5] as const

/** A length in µm as text with its unit: µm below 1 mm, mm from 1 mm, nm below 1 µm. */
export function formatLength(um: number): string {
  const a = Math.abs(um)
  if (a >= 1000) return `${trim(um / 1000)} mm`
  if (a > 0 && a < 1) return `${trim(um * 1000)} nm`
  return `${trim(um)} µm`
}

const trim = (v: number): string => String(Number(v.toPrecision(6)))

/**
 * The longest nice length whose bar is at most `maxPx` CSS pixels long at `pixelsPerMicrometre`.
 * Throws when the scale or the room is not a positive finite number (a caller bug, not user input).
 */
export function niceScaleBar(pixelsPerMicrometre: number, maxPx: number): ScaleBar {
  if (!(pixelsPerMicrometre > 0) || !Number.isFinite(pixelsPerMicrometre)) {
    throw new RangeError(`Scale must be a positive number of px per µm (got ${pixelsPerMicrometre})`)
  }
  if (!(maxPx > 0) || !Number.isFinite(maxPx)) throw new RangeError(`Scale bar room must be > 0 px (got ${maxPx})`)
  const maxUm = maxPx / pixelsPerMicrometre
  let exp = Math.floor(Math.log10(maxUm))
  let best = 0
  for (let e = exp - 1; e <= exp + 1; e++) {
    for (const s of STEPS) {
      const len = Number((s * 10 ** e).toPrecision(12))
      if (len <= maxUm * (1 + 1e-12) && len > best) best = len
    }
  }
  if (best === 0) {
    exp -= 1
    best = 10 ** exp
  }
  return { lengthUm: best, label: formatLength(best), px: best * pixelsPerMicrometre }
}

/** A coordinate in µm with as many decimals as one screen pixel resolves (0 to 3), with its unit. */
export function formatCoordinate(um: number, pixelsPerMicrometre: number): string {
  const umPerPx = 1 / pixelsPerMicrometre
  const decimals = Math.min(3, Math.max(0, Math.ceil(-Math.log10(umPerPx))))
  const v = um.toFixed(decimals)
  return `${v === `-${(0).toFixed(decimals)}` ? (0).toFixed(decimals) : v} µm`
}
