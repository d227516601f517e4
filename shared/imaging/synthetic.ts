// Synthetic bright-field micrographs of droplets with known diameters, for tests, the demo seed and the benchmark.
// Each drop is drawn the way an emulsion looks under transmitted light: a dark refracting rim and a slightly darker
// core on a bright background, with an uneven (vignetted, tilted) illumination, a Gaussian edge blur and Gaussian
// noise. Pure code: no image library, no I/O.
import type { GreyImage } from './types'

export interface SyntheticDrop {
  x: number
  y: number
  diameter: number
}

export interface SyntheticOptions {
  width: number
  height: number
  drops: readonly SyntheticDrop[]
  /** Standard deviation of the pixel noise, grey levels of 255. */
  noise?: number
  /** Edge blur: the 10–90 % width of an edge is about 2.6 × this, px. */
  blur?: number
  /** Peak-to-peak illumination change across the field, as a fraction of the background level (0–0.5). */
  unevenness?: number
  seed?: number
}

/** Mulberry32, a small seeded generator (public domain; Tommy Ettinger 2017): the same seed draws the same image. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** A standard normal deviate by the Box–Muller transform (Box & Muller 1958, Ann. Math. Statist. 29, 610). */
export function normal(random: () => number): number {
  const u = Math.max(random(), 1e-12)
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random())
}

/** Smooth step of an edge blurred by a Gaussian of σ = blur: the error-function profile (Abramowitz & Stegun 7.1.26). */
function edge(distance: number, blur: number): number {
  if (blur <= 0) return distance < 0 ? 1 : 0
  const x = -distance / (blur * Math.SQRT2)
  const t = 1 / (1 + 0.3275911 * Math.abs(x))
  const y =
    1 -
    ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-x * x)
  return 0.5 * (1 + (x >= 0 ? y : -y))
}

/** Renders the drops into an 8-bit grey image. */
export function renderMicrograph(options: SyntheticOptions): GreyImage {
  const { width, height, drops, noise = 4, blur = 0.8, unevenness = 0.3, seed = 1 } = options
  const random = seededRandom(seed)
  // Darkness (0 = background, 1 = black) per pixel, drops drawn over each other.
  const dark = new Float32Array(width * height)
  for (const drop of drops) {
    const r = drop.diameter / 2
    const rim = Math.max(1.5, r * 0.18)
    const reach = r + 4 * blur + 2
    const x0 = Math.max(0, Math.floor(drop.x - reach))
    const x1 = Math.min(width - 1, Math.ceil(drop.x + reach))
    const y0 = Math.max(0, Math.floor(drop.y - reach))
    const y1 = Math.min(height - 1, Math.ceil(drop.y + reach))
    for (let y = y0; y <= y1; y++) {
      for (let x = x0; x <= x1; x++) {
        const d = Math.hypot(x + 0.5 - drop.x, y + 0.5 - drop.y)
        const inside = edge(d - r, blur)
        if (inside <= 0.001) continue
        const core = edge(d - (r - rim), blur)
        const value = 0.75 * (inside - core) + 0.25 * core
        const i = y * width + x
        dark[i] = Math.max(dark[i]!, value)
      }
    }
  }
  const data = new Uint8Array(width * height)
  const cx = width * 0.35
  const cy = height * 0.4
  const span = Math.hypot(width, height)
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      // Vignetting about an off-centre point plus a tilt: the lamp's field is never flat.
      const fall = Math.hypot(x - cx, y - cy) / span
      const light = 215 * (1 - unevenness * (0.7 * fall * fall * 2 + 0.3 * (x / width)))
      const i = y * width + x
      const value = light * (1 - dark[i]!) + noise * normal(random)
      data[i] = Math.max(0, Math.min(255, Math.round(value)))
    }
  }
  return { width, height, data }
}

export interface ScatterOptions {
  width: number
  height: number
  count: number
  meanDiameter: number
  /** Coefficient of variation of the diameters (0.05 = 5 %). */
  cv: number
  seed?: number
  /** How many extra drops to place touching a drop already placed (they merge into one blob). */
  touching?: number
  /** Clear gap kept between separated drops and to the image edge, px. */
  gap?: number
}

/** Non-overlapping drops with normally distributed diameters, plus optional touching pairs. */
export function scatterDrops(options: ScatterOptions): { separated: SyntheticDrop[]; touching: SyntheticDrop[] } {
  const { width, height, count, meanDiameter, cv, seed = 7, touching = 0, gap = 6 } = options
  const random = seededRandom(seed * 7919 + 13)
  const separated: SyntheticDrop[] = []
  const cell = meanDiameter * (1 + 4 * cv) + gap * 2
  const grid = new Map<string, SyntheticDrop[]>()
  const key = (x: number, y: number) => `${Math.floor(x / cell)},${Math.floor(y / cell)}`
  const near = (x: number, y: number) => {
    const out: SyntheticDrop[] = []
    const gx = Math.floor(x / cell)
    const gy = Math.floor(y / cell)
    for (let i = -2; i <= 2; i++) for (let j = -2; j <= 2; j++) out.push(...(grid.get(`${gx + i},${gy + j}`) ?? []))
    return out
  }
  const fits = (x: number, y: number, d: number, spacing: number) =>
    near(x, y).every(o => Math.hypot(o.x - x, o.y - y) >= (o.diameter + d) / 2 + spacing)
  const add = (drop: SyntheticDrop) => {
    const k = key(drop.x, drop.y)
    grid.set(k, [...(grid.get(k) ?? []), drop])
  }
  let attempts = 0
  while (separated.length < count) {
    if (++attempts > count * 400)
      throw new RangeError(
        `Only ${separated.length} of ${count} drops of ${meanDiameter} px fit in ${width} × ${height} px: use a larger image or fewer drops`,
      )
    const d = Math.max(4, meanDiameter * (1 + cv * normal(random)))
    const margin = d / 2 + gap
    const x = margin + random() * (width - 2 * margin)
    const y = margin + random() * (height - 2 * margin)
    if (!fits(x, y, d, gap * 2)) continue
    const drop = { x, y, diameter: d }
    separated.push(drop)
    add(drop)
  }
  const pairs: SyntheticDrop[] = []
  attempts = 0
  while (pairs.length < touching * 2 && attempts++ < touching * 2000) {
    const d = meanDiameter
    const margin = d + gap
    const x = margin + random() * (width - 2 * margin)
    const y = margin + random() * (height - 2 * margin)
    const angle = random() * Math.PI
    // Two drops whose rims overlap by 10 % of a diameter: one blob, as drops pressed together in a chamber look.
    const a = { x: x - Math.cos(angle) * d * 0.45, y: y - Math.sin(angle) * d * 0.45, diameter: d }
    const b = { x: x + Math.cos(angle) * d * 0.45, y: y + Math.sin(angle) * d * 0.45, diameter: d }
    if (!fits(a.x, a.y, d, gap * 2) || !fits(b.x, b.y, d, gap * 2)) continue
    pairs.push(a, b)
    add(a)
    add(b)
  }
  return { separated, touching: pairs }
}
