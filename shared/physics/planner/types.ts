// Shapes of a plan answer. Every number is a quantity in the forecast's { value, unit, method, source, valid } form.
import type { Quantity, Warning } from '../quantity'
import type { RegimeName } from '../junction/regime'

/** How an axis of the window is driven: a volume flow (m³/s) or an inlet pressure (Pa, gauge). */
export type AxisMode = 'flow' | 'pressure'

export interface WindowAxis {
  phase: 'continuous' | 'dispersed'
  mode: AxisMode
  unit: string
  /** Log-spaced for flows, evenly spaced for pressures. */
  values: number[]
}

/** One scanned operating point as the core keeps it (SI numbers plus the forecast's own quantities). */
export interface ScanPoint {
  i: number
  j: number
  /** Axis values (the inlet settings of a document, the junction's flows otherwise). */
  xc: number
  xd: number
  /** Flows at the junction, m³/s. */
  qc: number
  qd: number
  /** Inlet pressures when pressure-driven, Pa. */
  pc?: number
  pd?: number
  /** Null when the junction makes no drops there (no dispersed flow, backflow, below its entry barrier). */
  diameter: Quantity | null
  frequency: Quantity | null
  regime: RegimeName | 'none'
  /** Inside the size and rate methods' validity. */
  valid: boolean
  /** Inside the pump's and the bond's pressure limits (true when none apply). */
  withinLimits: boolean
  /** Highest inlet pressure the point needs, Pa (document scans). */
  inletPressure?: number
  hit: boolean
  /** First warning code of the forecast there, to explain invalid points. */
  why?: string
}

export interface Scan {
  continuous: WindowAxis
  dispersed: WindowAxis
  points: ScanPoint[]
  junctionId?: string
}

export interface PlanTarget {
  diameter: number
  volume: number
  tolerance: number
  minFrequency?: number
}

/** A point of the window as answered. */
export interface WindowPoint {
  flow: { continuous: Quantity; dispersed: Quantity }
  pressure?: { continuous: Quantity; dispersed: Quantity }
  dropletDiameter: Quantity | null
  frequency: Quantity | null
  regime: RegimeName | 'none'
  valid: boolean
  withinLimits: boolean
  hit: boolean
}

export interface Contour {
  /** What the line follows: the target diameter, its tolerance edges, or the minimum rate. */
  name: 'target-diameter' | 'diameter-low' | 'diameter-high' | 'min-frequency'
  level: Quantity
  /** [continuous, dispersed] axis values (flow m³/s or pressure Pa) along the line. */
  points: [number, number][]
}

export interface PlanWindow {
  mode: { continuous: AxisMode; dispersed: AxisMode }
  axes: { continuous: WindowAxis; dispersed: WindowAxis }
  junction?: string
  points: WindowPoint[]
  contours: Contour[]
  counts: { points: number; valid: number; hits: number; validHits: number; regimes: Record<string, number> }
}

export interface Recommended extends WindowPoint {
  reason: string
  /** Document plans: the operating point and the inlet settings that make this point ("Use this point"). */
  operatingPoint?: string
  inlets?: import('../../schemas/chip').OperatingPoint['inlets']
}

export interface Unreachable {
  reason: string
  nearest: { dropletDiameter: Quantity; point: WindowPoint } | null
  reachable: { smallest: Quantity; largest: Quantity } | null
}

export interface PlanAnswer {
  target: { dropletDiameter: Quantity; dropletVolume: Quantity; tolerance: number; minFrequency?: Quantity }
  window: PlanWindow
  recommended: Recommended | null
  unreachable?: Unreachable
  geometry: import('./geometry').GeometrySuggestion[]
  encapsulation?: import('./poisson').Encapsulation
  digital?: import('./digital').DigitalAssay
  run?: import('./runPlan').RunPlan
  warnings: Warning[]
}
