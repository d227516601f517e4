// Upper bounds of the chip document. A real chip never comes near them; they exist so that one request's
// work is bounded: outlines, rules, the forecast and the DXF all grow with these numbers. Each reason is
// "common practice, no source" unless a source is named. Documented in ./README.md ("Limits").
export const CHIP_LIMITS = {
  /** |x|, |y| of every point: the largest common wafer is 300 mm (SEMI M1), ±150 000 µm about its centre. */
  coordinateUm: 200_000,
  /** Any length, width, pitch or size: the span of the coordinate range. */
  lengthUm: 400_000,
  /** Smallest length: 10 nm, below what any mask or mould resolves (common practice, no source). */
  minLengthUm: 0.01,
  /** Punch diameter: PDMS biopsy punches are 0.5–5 mm (common practice, no source). */
  punchDiameterUm: 10_000,
  /** Layer depth: soft-lithography moulds are at most a few mm deep (common practice, no source). */
  depthUm: 5_000,
  /** Text height on the mask (common practice, no source). */
  textHeightUm: 20_000,
  /** Rotation, degrees: the editor keeps it within one turn. */
  rotationDeg: 360,
  /** Nozzles in one step array: 10 000 at a 10 µm pitch is a 100 mm row. */
  nozzlesPerArray: 10_000,
  /** Turns of one serpentine: resistors have tens to a few hundred (common practice, no source). */
  serpentineTurns: 2_000,
  /** Points of one channel centre line or of a polygon outline (self-crossing checks are quadratic in it). */
  pointsPerLine: 2_000,
  /** Channel points in the whole document. */
  channelPoints: 200_000,
  /** Elements of each kind in one document. */
  layers: 32,
  ports: 2_000,
  channels: 50_000,
  components: 20_000,
  marks: 1_000,
  operatingPoints: 100,
  /** Inlet settings of one operating point (one per port at most). */
  inletsPerOperatingPoint: 2_000,
  /** Channel layers one mark is also drawn on. */
  layersPerMark: 32,
  /**
   * Drawn pieces in the whole document (channel segments and their joins, nozzles, serpentine runs and turns,
   * arms of the other parts, punches, marks): what outline merging, rules and the DXF cost. The 4,096-nozzle
   * chip of `planParallelChip` has 16 653, the 8,192-nozzle one about 33 300. The largest accepted document
   * (tests/unit/schemas/largest.ts) takes 10–50 s per stage on a loaded 2-core machine, within the worker's 120 s budget.
   */
  pieces: 40_000,
  /** Text: names, labels and marks. */
  nameChars: 200,
  textChars: 200,
  /** Inlet pressure, mbar: 10 MPa, far above any bonded chip (PDMS–glass bonds hold a few bar). */
  pressureMbar: 100_000,
  /** Inlet flow rate, µL/min (100 mL/min). */
  flowUlPerMin: 100_000,
  /** Liquid properties: from gases to pastes, mPa·s, kg/m³ (osmium is 22 590), mN/m (mercury is ≈ 485). */
  viscosityMPaS: { min: 1e-3, max: 1e7 },
  densityKgPerM3: { min: 0.01, max: 30_000 },
  tensionMNPerM: { min: 1e-3, max: 1_000 },
} as const

/** A limit as messages show it: `200 000` (a space between thousands from 10 000 on), `0.01`. */
export function shownLimit(n: number): string {
  if (!Number.isInteger(n) || Math.abs(n) < 10_000) return String(n)
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ' ')
}
