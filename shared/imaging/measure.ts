// Finds and measures droplets in a bright-field micrograph: flat-field correction, a global threshold, hole
// filling, connected components, then shape and edge filters. Pure code on image-js (no I/O): the server's worker,
// the CLI and the benchmark call the same function.
//
// Method (the classic particle-analysis pipeline):
//   1. background: the 90th percentile of 64-px tiles, interpolated bilinearly, divides the image (flat-field
//      correction of uneven illumination; Russ & Neal 2016, The Image Processing Handbook, 7th ed., ch. 4 — from memory);
//   2. threshold: after a σ ≈ 1 px binomial smoothing, Otsu 1979 (N. Otsu, IEEE Trans. Syst. Man Cybern. 9, 62–66), between background and drop rims;
//   3. holes filled (a flood fill from the border: a drop's bright core joins its rim), then 4-connected components (Rosenfeld & Pfaltz 1966,
//      J. ACM 13, 471) through image-js's ROI map;
//   4. filters: components cut by the image edge are rejected (their size is unknown); circularity 4πA/P² and the
//      minor/major axis ratio of the moment ellipse reject touching or deformed drops (Russ & Neal 2016, ch. 11 —
//      from memory; the cut-offs 0.8 and 0.85 are common practice, no source);
//   5. size: the area-equivalent diameter d = 2√(A/π) of the filled component, refined to sub-pixel by the
//      half-contrast crossing of the edge along 32 rays (the "50 % edge" of Canny-free edge location; common practice).
import { computeThreshold, fromMask, Image, Mask } from 'image-js'
import { describeSample, type SampleSummary } from '../physics/calibration/stats'
import type { GreyImage } from './types'

export type RejectReason = 'edge' | 'too-small' | 'not-round' | 'excluded'

export interface DetectedDrop {
  id: number
  /** Centre, px from the top-left corner. */
  x: number
  y: number
  diameterPx: number
  diameterUm: number
  areaPx: number
  circularity: number
  /** Smallest over largest Feret (calliper) diameter; 0 when not measured (a component already not round). */
  aspect: number
  accepted: boolean
  reason?: RejectReason
}

export interface MeasureOptions {
  /** Scale, µm per pixel (> 0). */
  umPerPx: number
  /** Components smaller than this diameter are noise, px (default 4). */
  minDiameterPx?: number
  minCircularity?: number
  minAspect?: number
  /** Called with 0–1 as the work advances. */
  onProgress?: (fraction: number) => void
}

export interface Measurement {
  width: number
  height: number
  umPerPx: number
  threshold: number
  drops: DetectedDrop[]
  /** Of the accepted drops, µm. */
  summary: SampleSummary | null
  method: string
}

export const DETECTION_METHOD =
  'flat-field (tile 90th percentile) + Otsu 1979 threshold + hole fill + connected components; edge, circularity ≥ 0.8 and Feret ratio ≥ 0.85 filters; 50 % edge refinement on 32 rays'

const TILE = 64

/** Background level per pixel: the 90th percentile of each tile, bilinear between tile centres. */
function background(image: GreyImage): Float32Array {
  const { width, height, data } = image
  const tx = Math.max(1, Math.ceil(width / TILE))
  const ty = Math.max(1, Math.ceil(height / TILE))
  const level = new Float32Array(tx * ty)
  const histogram = new Uint32Array(256)
  for (let j = 0; j < ty; j++) {
    for (let i = 0; i < tx; i++) {
      histogram.fill(0)
      let count = 0
      for (let y = j * TILE; y < Math.min(height, (j + 1) * TILE); y++) {
        for (let x = i * TILE; x < Math.min(width, (i + 1) * TILE); x++) {
          histogram[data[y * width + x]!]!++
          count++
        }
      }
      let seen = 0
      let v = 255
      for (let g = 0; g < 256; g++) {
        seen += histogram[g]!
        if (seen >= count * 0.9) {
          v = g
          break
        }
      }
      level[j * tx + i] = Math.max(1, v)
    }
  }
  const out = new Float32Array(width * height)
  for (let y = 0; y < height; y++) {
    const fy = Math.min(ty - 1, Math.max(0, (y + 0.5) / TILE - 0.5))
    const j0 = Math.floor(fy)
    const j1 = Math.min(ty - 1, j0 + 1)
    const wy = fy - j0
    for (let x = 0; x < width; x++) {
      const fx = Math.min(tx - 1, Math.max(0, (x + 0.5) / TILE - 0.5))
      const i0 = Math.floor(fx)
      const i1 = Math.min(tx - 1, i0 + 1)
      const wx = fx - i0
      out[y * width + x] =
        (1 - wy) * ((1 - wx) * level[j0 * tx + i0]! + wx * level[j0 * tx + i1]!) +
        wy * ((1 - wx) * level[j1 * tx + i0]! + wx * level[j1 * tx + i1]!)
    }
  }
  return out
}

/**
 * Two passes of the [1 2 1]/4 binomial kernel along each axis: a Gaussian of σ = 1 px to within a few per cent
 * (the binomial approximation of the Gaussian; Burt & Adelson 1983, IEEE Trans. Commun. 31, 532), so pixel noise
 * does not fray the components' outlines (and their circularity).
 */
function binomialSmooth(src: Uint8Array, width: number, height: number): Uint8Array {
  let a = new Float32Array(src)
  let b = new Float32Array(src.length)
  for (let pass = 0; pass < 2; pass++) {
    for (let y = 0; y < height; y++) {
      const row = y * width
      for (let x = 0; x < width; x++) {
        const l = a[row + Math.max(0, x - 1)]!
        const r = a[row + Math.min(width - 1, x + 1)]!
        b[row + x] = 0.25 * l + 0.5 * a[row + x]! + 0.25 * r
      }
    }
    ;[a, b] = [b, a]
    for (let y = 0; y < height; y++) {
      const up = Math.max(0, y - 1) * width
      const down = Math.min(height - 1, y + 1) * width
      const row = y * width
      for (let x = 0; x < width; x++) b[row + x] = 0.25 * a[up + x]! + 0.5 * a[row + x]! + 0.25 * a[down + x]!
    }
    ;[a, b] = [b, a]
  }
  const out = new Uint8Array(src.length)
  for (let i = 0; i < out.length; i++) out[i] = Math.round(a[i]!)
  return out
}

/**
 * Mask of the dark side (value ≤ threshold) with holes filled: every bright pixel that cannot reach the image border
 * through bright pixels (4-connected flood fill from the border) belongs to a drop — its bright core.
 */
function fillHoles(values: Uint8Array, width: number, height: number, threshold: number): Uint8Array {
  const n = width * height
  const mask = new Uint8Array(n)
  for (let i = 0; i < n; i++) mask[i] = values[i]! <= threshold ? 1 : 0
  const outside = new Uint8Array(n)
  const stack = new Int32Array(n)
  let top = 0
  const push = (i: number) => {
    if (!mask[i] && !outside[i]) {
      outside[i] = 1
      stack[top++] = i
    }
  }
  for (let x = 0; x < width; x++) {
    push(x)
    push((height - 1) * width + x)
  }
  for (let y = 0; y < height; y++) {
    push(y * width)
    push(y * width + width - 1)
  }
  while (top > 0) {
    const i = stack[--top]!
    const x = i % width
    if (x > 0) push(i - 1)
    if (x < width - 1) push(i + 1)
    if (i >= width) push(i - width)
    if (i < n - width) push(i + width)
  }
  for (let i = 0; i < n; i++) mask[i] = outside[i] ? 0 : 1
  return mask
}

/** Bilinear sample of the corrected image at (x, y) in pixel-centre coordinates. */
function sample(values: Uint8Array, width: number, height: number, x: number, y: number): number {
  const fx = Math.min(width - 1.001, Math.max(0, x - 0.5))
  const fy = Math.min(height - 1.001, Math.max(0, y - 0.5))
  const x0 = Math.floor(fx)
  const y0 = Math.floor(fy)
  const wx = fx - x0
  const wy = fy - y0
  const i = y0 * width + x0
  return (
    (1 - wy) * ((1 - wx) * values[i]! + wx * values[i + 1]!) +
    wy * ((1 - wx) * values[i + width]! + wx * values[i + width + 1]!)
  )
}

/**
 * Sub-pixel radius: along each of 32 rays from the centre, the first crossing (outward from the darkest rim value)
 * of the level halfway between that rim value and the local background (the median of the rays' far ends).
 * The mean over rays is the radius.
 */
function refineRadius(flat: Uint8Array, width: number, height: number, x: number, y: number, r: number): number | null {
  const rays = 32
  const reach = r * 1.25 + 3
  const step = 0.25
  const far: number[] = []
  for (let k = 0; k < rays; k++) {
    const a = (2 * Math.PI * k) / rays
    far.push(sample(flat, width, height, x + Math.cos(a) * reach, y + Math.sin(a) * reach))
  }
  far.sort((p, q) => p - q)
  const local = far[rays >> 1]!
  let total = 0
  let counted = 0
  for (let k = 0; k < rays; k++) {
    const a = (2 * Math.PI * k) / rays
    const dx = Math.cos(a)
    const dy = Math.sin(a)
    let darkest = 255
    let darkestAt = 0
    for (let s = 0; s <= reach; s += step) {
      const v = sample(flat, width, height, x + dx * s, y + dy * s)
      if (v < darkest) {
        darkest = v
        darkestAt = s
      }
    }
    const half = (local + darkest) / 2
    let previous = darkest
    for (let s = darkestAt; s <= reach; s += step) {
      const v = sample(flat, width, height, x + dx * s, y + dy * s)
      if (v >= half) {
        total += s - (step * (v - half)) / Math.max(1e-6, v - previous)
        counted++
        break
      }
      previous = v
    }
  }
  return counted >= rays / 2 ? total / counted : null
}

export function measureDrops(image: GreyImage, options: MeasureOptions): Measurement {
  const { width, height, data } = image
  if (!(options.umPerPx > 0) || !Number.isFinite(options.umPerPx))
    throw new RangeError(`Scale must be > 0 µm per pixel (got ${options.umPerPx})`)
  if (width * height !== data.length)
    throw new RangeError(`Image data has ${data.length} pixels, expected ${width} × ${height}`)
  const progress = options.onProgress ?? (() => {})
  const minDiameter = options.minDiameterPx ?? 4
  const minCircularity = options.minCircularity ?? 0.8
  const minAspect = options.minAspect ?? 0.85

  // 1. Flat field: the background maps to 200 of 255, so drops and noise keep their contrast.
  const bg = background(image)
  const flat = new Uint8Array(width * height)
  for (let i = 0; i < flat.length; i++) flat[i] = Math.min(255, Math.round((200 * data[i]!) / bg[i]!))
  progress(0.2)

  // 2–3. Smooth, Otsu threshold (drops are the dark side), fill holes, label components.
  const smooth = binomialSmooth(flat, width, height)
  const grey = new Image(width, height, { colorModel: 'GREY', data: smooth })
  const cut = computeThreshold(grey, { algorithm: 'otsu' })
  const level = new Mask(width, height, { data: fillHoles(smooth, width, height, cut) })
  progress(0.5)
  const rois = fromMask(level).getRois({ kind: 'white' })
  progress(0.7)

  const drops: DetectedDrop[] = []
  let id = 0
  for (const roi of rois) {
    const area = roi.surface
    const d0 = 2 * Math.sqrt(area / Math.PI)
    if (d0 < minDiameter) continue
    id++
    const { column, row } = roi.origin
    const centroid = roi.centroid
    const x = centroid.column + 0.5
    const y = centroid.row + 0.5
    const circularity = Math.min(1, (4 * Math.PI * area) / roi.perimeter ** 2)
    const aspect = circularity >= minCircularity ? roi.feret.aspectRatio : 0
    const touchesEdge = column <= 0 || row <= 0 || column + roi.width >= width || row + roi.height >= height
    let reason: RejectReason | undefined
    if (touchesEdge) reason = 'edge'
    else if (circularity < minCircularity || aspect < minAspect) reason = 'not-round'
    let diameterPx = d0
    if (!reason) {
      const r = refineRadius(flat, width, height, x, y, d0 / 2)
      if (r !== null && Math.abs(2 * r - d0) < 0.25 * d0) diameterPx = 2 * r
    }
    drops.push({
      id,
      x,
      y,
      diameterPx,
      diameterUm: diameterPx * options.umPerPx,
      areaPx: area,
      circularity: round(circularity, 3),
      aspect: round(aspect, 3),
      accepted: !reason,
      ...(reason ? { reason } : {}),
    })
  }
  progress(1)
  return summarise({ width, height, umPerPx: options.umPerPx, threshold: cut, drops, method: DETECTION_METHOD })
}

const round = (v: number, digits: number) => Number(v.toFixed(digits))

/** The summary of the accepted drops (after the user's exclusions). */
export function summarise(measurement: Omit<Measurement, 'summary'>): Measurement {
  const accepted = measurement.drops.filter(d => d.accepted).map(d => d.diameterUm)
  return { ...measurement, summary: accepted.length ? describeSample(accepted) : null }
}

/** Marks drops the user excluded (false detections) and re-summarises. */
export function excludeDrops(measurement: Measurement, excluded: readonly number[]): Measurement {
  const out = new Set(excluded)
  return summarise({
    ...measurement,
    drops: measurement.drops.map(d =>
      out.has(d.id)
        ? { ...d, accepted: false, reason: 'excluded' as const }
        : d.reason === 'excluded'
          ? { ...d, accepted: true, reason: undefined }
          : d,
    ),
  })
}
