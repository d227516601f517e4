/**
 * Hydraulic resistance of a rectangular channel per unit viscosity, R/μ = 12 L / (w h³ (1 − 0.63 h/w)) with
 * h the smaller and w the larger side (Bruus 2008, Theoretical Microfluidics, OUP — the book is
 * the source; the section number §4.4 is from memory and NOT verified, the error, checked here against the exact
 * Fourier-series solution for a rectangular duct, is +14 % at a square section and falls for flatter ones
 * (tests/unit/geometry/arrays.test.ts)). Lengths in µm, result in µm⁻³. Only ratios of these
 * values are used here, so the units cancel; the forecast's exact series lives in shared/physics.
 */
export function rectResistancePerViscosity(width: number, depth: number, length: number): number {
  const h = Math.min(width, depth)
  const w = Math.max(width, depth)
  return (12 * length) / (w * h ** 3 * (1 - 0.63 * (h / w)))
}

/**
 * First-order flow non-uniformity of a ladder of N equal nozzles (resistance Rn) fed from one end of a manifold
 * whose segments between nozzles have resistance r: the pressure lost along the manifold is
 * Σ_{k=1}^{N−1} (N − k)·q·r = q·r·N(N−1)/2 against q·Rn across a nozzle, so δ ≈ r·N(N−1)/(2·Rn)
 * (derived here from Kirchhoff's laws assuming equal nozzle flows q; valid for δ ≪ 1). Keeping the manifold
 * resistance well below the nozzles' (δ of a few per cent) is common practice, no source.
 */
export function ladderNonUniformity(segment: number, nozzle: number, n: number): number {
  return (segment * n * (n - 1)) / (2 * nozzle)
}

/**
 * Narrowest manifold width in [minWidth, maxWidth] whose non-uniformity is ≤ target (bisection; δ falls
 * monotonically with width). Returns the width and the δ it achieves (maxWidth and its δ if none suffices).
 */
export function sizeManifold(args: {
  nozzle: number
  n: number
  depth: number
  segmentLength: number
  target: number
  minWidth: number
  maxWidth: number
}): { width: number; nonUniformity: number } {
  const delta = (w: number) =>
    ladderNonUniformity(rectResistancePerViscosity(w, args.depth, args.segmentLength), args.nozzle, args.n)
  if (delta(args.minWidth) <= args.target) return { width: args.minWidth, nonUniformity: delta(args.minWidth) }
  if (delta(args.maxWidth) > args.target) return { width: args.maxWidth, nonUniformity: delta(args.maxWidth) }
  let lo = args.minWidth
  let hi = args.maxWidth
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2
    if (delta(mid) <= args.target) hi = mid
    else lo = mid
  }
  const width = Math.ceil(hi) // whole micrometres for the mask
  return { width, nonUniformity: delta(width) }
}
