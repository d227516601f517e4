// Geometry of a confined plug (a drop longer than the channel is wide) and the derived train quantities.
import type { Method } from '../quantity'
import { mspRadius } from './laplace'
import type { CubicMetres, CubicMetresPerSecond, Hertz, Metres } from '../units'

export const PLUG_VOLUME: Method = {
  id: 'musterd-2015-plug-volume',
  source:
    'V = [hw − (4 − π) r²](L − w) + (π/4)h(w − h)² + (π²/8)h²(w − h) + (π/6)h³, plug of length L in a w × h channel (h ≤ w the smaller side), ' +
    "caps as a pancake with a rim of radius h/2 (Musterd, van Steijn, Kleijn & Kreutzer 2015, RSC Adv. 5, 16042; re-derived here by Pappus's theorem), " +
    'body gutters of the Mayer–Stowe–Princen corner radius r (Wong, Radke & Morris 1995, J. Fluid Mech. 292, 71; r → h/2 for h ≪ w); ' +
    'a drop shorter than the larger side is a disc of diameter L squeezed to h, shorter than h a sphere',
}
export const SPHERE_EQUIVALENT: Method = {
  id: 'sphere-equivalent-diameter',
  source: 'd = (6V/π)^(1/3), diameter of the sphere of equal volume',
}
export const GENERATION_RATE: Method = {
  id: 'generation-rate',
  source: 'f = Qd / V, continuity (Garstecki et al. 2006, Lab Chip 6, 437)',
}
export const TRAIN_SPACING: Method = {
  id: 'train-spacing',
  source:
    'λ = U / f, U = (Qc + Qd)/(w h) mean speed of the train (continuity, neglecting droplet slip and gutter flow)',
}
export const DISPERSED_FRACTION: Method = {
  id: 'dispersed-fraction',
  source: 'φ = Qd/(Qc + Qd), volume fraction of the train (continuity)',
}

function sides(width: Metres, depth: Metres): { w: number; h: number } {
  return width >= depth ? { w: width, h: depth } : { w: depth, h: width }
}

/** Volume of the two caps together: a "pancake" of diameter w and thickness h with a rim of radius h/2. */
function capsVolume(w: number, h: number): number {
  return (Math.PI / 4) * h * (w - h) ** 2 + (Math.PI ** 2 / 8) * h ** 2 * (w - h) + (Math.PI / 6) * h ** 3
}

/**
 * Cross-section of the plug body: the channel section less four gutters, (1 − π/4) r² each, r the
 * Mayer–Stowe–Princen corner radius (the body's interface has the caps' curvature). r = h/2 only for h ≪ w.
 */
function bodyArea(w: number, h: number): number {
  return w * h - (4 - Math.PI) * mspRadius(w as Metres, h as Metres, 0) ** 2
}

/**
 * Drop volume from its length L (Musterd et al. 2015 for L ≥ w). The smaller of width/depth plays h, so a
 * deep narrow channel (depth > width) is the same channel turned on its side. A drop shorter than the larger
 * side cannot be a plug: it is a disc of diameter L squeezed to thickness h (the caps' shape with w → L), and
 * below L = h a sphere — continuous at both joins, and never negative.
 */
export function plugVolume(length: Metres, width: Metres, depth: Metres): CubicMetres {
  const { w, h } = sides(width, depth)
  if (length >= w) return (bodyArea(w, h) * (length - w) + capsVolume(w, h)) as CubicMetres
  if (length >= h) return capsVolume(length, h) as CubicMetres
  return ((Math.PI / 6) * length ** 3) as CubicMetres
}

/** Inverse of plugVolume: the length of a drop of volume V (linear for plugs, by bisection for discs). */
export function plugLength(volume: CubicMetres, width: Metres, depth: Metres): Metres {
  const { w, h } = sides(width, depth)
  if (volume >= capsVolume(w, h)) return (w + (volume - capsVolume(w, h)) / bodyArea(w, h)) as Metres
  if (volume <= (Math.PI / 6) * h ** 3) return Math.cbrt((6 * volume) / Math.PI) as Metres
  let lo = h
  let hi = w
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2
    if (capsVolume(mid, h) < volume) lo = mid
    else hi = mid
  }
  return ((lo + hi) / 2) as Metres
}

/** Smallest volume that is still a plug (L = w): below it the drop is not confined lengthwise. */
export function minimumPlugVolume(width: Metres, depth: Metres): CubicMetres {
  const { w, h } = sides(width, depth)
  return capsVolume(w, h) as CubicMetres
}

export const sphereEquivalentDiameter = (volume: CubicMetres): Metres => Math.cbrt((6 * volume) / Math.PI) as Metres
export const sphereVolume = (diameter: Metres): CubicMetres => ((Math.PI / 6) * diameter ** 3) as CubicMetres
export const generationRate = (dispersedFlow: CubicMetresPerSecond, volume: CubicMetres): Hertz =>
  (dispersedFlow / volume) as Hertz

export function trainSpacing(
  continuousFlow: CubicMetresPerSecond,
  dispersedFlow: CubicMetresPerSecond,
  width: Metres,
  depth: Metres,
  frequency: Hertz,
): Metres {
  return ((continuousFlow + dispersedFlow) / (width * depth) / frequency) as Metres
}

export const dispersedFraction = (continuousFlow: number, dispersedFlow: number): number =>
  dispersedFlow / (continuousFlow + dispersedFlow)
