/**
 * Wafer diameters a mould is commonly made on, mm: 3-inch (76.2) and the 100, 150, 200 and 300 mm sizes of the
 * SEMI M1 silicon wafer specification.
 */
export const WAFER_DIAMETERS_MM = [76.2, 100, 150, 200, 300] as const

/** Ring at the wafer edge kept free of features (resist edge bead, clamps), mm — common practice, no source. */
export const WAFER_EDGE_EXCLUSION_MM = 5

export interface WaferFit {
  /** Smallest listed wafer the chip fits on, mm; null when it fits none. */
  diameterMm: number | null
  /** Chip diagonal, mm: a centred rectangle fits when its diagonal ≤ the usable diameter. */
  diagonalMm: number
}

/**
 * Smallest wafer on which a centred `width` × `height` µm chip lies inside the usable disc (diameter minus twice
 * the edge exclusion). The orientation flat is ignored: with a 5 mm exclusion the usable disc of a 100 mm wafer
 * (45 mm radius) stays clear of its primary flat (≈ 47 mm from the centre for a 32.5 mm flat, SEMI M1).
 */
export function waferFor(width: number, height: number): WaferFit {
  const diagonalMm = Math.hypot(width, height) / 1000
  const d = WAFER_DIAMETERS_MM.find(w => diagonalMm <= w - 2 * WAFER_EDGE_EXCLUSION_MM)
  return { diameterMm: d ?? null, diagonalMm }
}
