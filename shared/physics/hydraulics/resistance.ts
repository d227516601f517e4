// Hydraulic resistance of straight channels in laminar (Poiseuille) flow.
import type { Method } from '../quantity'
import type { HydraulicResistance, Metres, PascalSeconds } from '../units'

export const RECT_SERIES: Method = {
  id: 'bruus-2008-rectangular-series',
  source:
    'R = 12ηL/(wh³) · [1 − Σ_{n odd} 192 h/(π⁵ n⁵ w) tanh(nπw/(2h))]⁻¹, h ≤ w (Bruus 2008, Theoretical Microfluidics, eqs. 4.37–4.38)',
}
export const RECT_APPROX: Method = {
  id: 'bruus-2008-rectangular-approx',
  source:
    'R ≈ 12ηL/(1 − 0.63 h/w) · 1/(h³w), h ≤ w (Bruus 2008, Theoretical Microfluidics, eq. 4.39); overestimates by at most 14 % of the exact value at h = w (Bruus quotes 13 %); see shared/physics/README.md',
}
export const HAGEN_POISEUILLE: Method = {
  id: 'hagen-poiseuille',
  source: 'R = 8ηL/(π r⁴), circular tube (Bruus 2008, Theoretical Microfluidics, eq. 4.28)',
}

export type ResistanceMethod = 'series' | 'approximate'

/** Terms of the odd-n series; tanh saturates to 1 past nπw/(2h) ≈ 20, and the n⁻⁵ tail is below 1e-14 by n = 401. */
const SERIES_TERMS = 200

/** Correction factor [1 − Σ …]⁻¹ of the exact series for aspect h/w ≤ 1. */
const factorCache = new Map<number, number>()

export function seriesFactor(aspect: number): number {
  const cached = factorCache.get(aspect)
  if (cached !== undefined) return cached
  if (factorCache.size > 1024) factorCache.clear()
  const factor = computeSeriesFactor(aspect)
  factorCache.set(aspect, factor)
  return factor
}

function computeSeriesFactor(aspect: number): number {
  let sum = 0
  for (let k = 0; k < SERIES_TERMS; k++) {
    const n = 2 * k + 1
    sum += Math.tanh((n * Math.PI) / (2 * aspect)) / n ** 5
  }
  return 1 / (1 - ((192 * aspect) / Math.PI ** 5) * sum)
}

/** Exact rectangular-channel resistance (Bruus 2008 eq. 4.37/4.38); symmetric in width and depth. */
export function rectangularResistance(
  viscosity: PascalSeconds,
  length: Metres,
  width: Metres,
  depth: Metres,
): HydraulicResistance {
  const w = Math.max(width, depth)
  const h = Math.min(width, depth)
  return (((12 * viscosity * length) / (w * h ** 3)) * seriesFactor(h / w)) as HydraulicResistance
}

/** Bruus's approximation R ≈ 12ηL/((1 − 0.63 h/w) h³ w), with h the smaller side. */
export function rectangularResistanceApprox(
  viscosity: PascalSeconds,
  length: Metres,
  width: Metres,
  depth: Metres,
): HydraulicResistance {
  const w = Math.max(width, depth)
  const h = Math.min(width, depth)
  return ((12 * viscosity * length) / ((1 - 0.63 * (h / w)) * h ** 3 * w)) as HydraulicResistance
}

/** Circular tubing by Hagen–Poiseuille. */
export function circularResistance(viscosity: PascalSeconds, length: Metres, diameter: Metres): HydraulicResistance {
  return ((128 * viscosity * length) / (Math.PI * diameter ** 4)) as HydraulicResistance
}

/**
 * Poiseuille number fRe (Darcy friction factor × Reynolds on the hydraulic diameter) of a rectangle:
 * fRe = 2 R A Dh² / (ηL). For comparison with Shah & London (1978), Laminar Flow Forced Convection in Ducts, Table 43.
 */
export function poiseuilleNumber(width: Metres, depth: Metres): number {
  const area = width * depth
  const dh = (2 * width * depth) / (width + depth)
  return 2 * rectangularResistance(1 as PascalSeconds, 1 as Metres, width, depth) * area * dh ** 2
}
