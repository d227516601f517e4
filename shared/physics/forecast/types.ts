// Shapes of a junction forecast: resolved inputs in SI and the answer.
import type { LiquidProperties } from '../liquids'
import type { Quantity, Warning } from '../quantity'
import type { JunctionKind, Regime } from '../junction/regime'

export interface ResolvedJunction {
  kind: JunctionKind
  mainWidth: number
  inletWidth: number
  depth: number
  continuous: LiquidProperties
  dispersed: LiquidProperties
  interfacialTension: Quantity
  /** Radians, dispersed phase measured through itself; absent when not given. */
  contactAngle?: number
  temperature: number
  flowContinuous: number
  flowDispersed: number
  /** User-set or fitted squeezing coefficient. */
  alpha?: number
}

export interface JunctionForecast {
  inputs: {
    junction: { kind: JunctionKind; mainWidth: Quantity; inletWidth: Quantity; depth: Quantity }
    continuous: LiquidProperties
    dispersed: LiquidProperties
    interfacialTension: Quantity
    contactAngle?: Quantity
    temperature: Quantity
    flow: { continuous: Quantity; dispersed: Quantity }
    model: { alpha?: number }
  }
  capillaryNumber: Quantity
  reynoldsNumber: Quantity
  weberNumber: Quantity
  bondNumber: Quantity
  ohnesorgeNumber: Quantity
  capillaryLength?: Quantity
  viscosityRatio: Quantity
  flowRateRatio: Quantity
  laplacePressure: Quantity
  entryPressure?: Quantity
  regime: Regime
  dropletLength?: Quantity
  dropletVolume: Quantity
  dropletDiameter: Quantity
  frequency: Quantity
  spacing?: Quantity
  dispersedFraction: Quantity
  warnings: Warning[]
}

/** What a droplet-size method returns before it is wrapped into quantities. */
export interface SizeEstimate {
  volume: number
  length?: number
  method: { id: string; source: string }
  valid: boolean
  warnings: Warning[]
}
