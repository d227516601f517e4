// Shapes of a chip-document forecast: the compiled network (SI) and the answer.
import type { JunctionForecast } from '../forecast/types'
import type { LiquidLibrary, LiquidProperties } from '../liquids'
import type { Margin, Uniformity } from '../network'
import type { Method, Quantity, Warning } from '../quantity'
import type { JunctionKind } from '../../utils/junctionKinds'

/** The document kinds that break drops; every nozzle of a step array is its own junction. */
export type DocumentJunctionKind = JunctionKind

/** One straight hydraulic element of the compiled chip, in SI. */
export interface CompiledChannel {
  /** Document channel id, or `<component id>/<part>` for a component's internals. */
  id: string
  /** The document element it belongs to (channel or component id). */
  element: string
  from: string
  to: string
  width: number
  depth: number
  length: number
}

/** A junction and the internal channels that carry its two phases towards it. */
export interface CompiledJunction {
  id: string
  kind: DocumentJunctionKind
  element: string
  /** Nozzle index (0-based) within a step array. */
  nozzle?: number
  /** SI; mainWidth is the main channel, orifice or nozzle width. */
  mainWidth: number
  inletWidth: number
  depth: number
  /** Channel index whose positive flow is the dispersed phase entering the junction. */
  dispersed: number
  /** Channel indices of the continuous phase: summed flows into the junction, or the largest crossflow past a step. */
  continuous: number[]
  continuousRule: 'sum' | 'largest'
  /** Junctions with equal keys are meant to carry equal flow (parallel nozzles). */
  parallelKey: string
}

export type DocumentSource = { port: string; kind: 'inlet' | 'outlet'; node: string } & (
  { mode: 'pressure'; pressure: number } | { mode: 'flow'; flow: number }
)

export interface CompiledDocument {
  channels: CompiledChannel[]
  junctions: CompiledJunction[]
  /** Inlets per the operating point, outlets at 0 Pa gauge. */
  sources: DocumentSource[]
  warnings: DocumentWarning[]
}

/** A warning located on a document element when it has one. */
export interface DocumentWarning extends Warning {
  element?: string
}

export interface DocumentJunction {
  id: string
  kind: DocumentJunctionKind
  element: string
  nozzle?: number
  /** Null when the junction cannot be forecast (no dispersed flow, backflow, below its entry barrier, no tension); a warning says why. */
  forecast: JunctionForecast | null
  /** The dispersed arm's entry barrier and its state; `dropsFrom` is the inlet pressure at which drops start when it is below. */
  entry?: { barrier: Quantity; state: 'open' | 'below-barrier' | 'backflow'; dropsFrom?: Quantity }
}

export interface DocumentUniformity extends Uniformity {
  /** Nozzle (or dispersed-arm) channel ids and their junction ids. */
  channels: string[]
  junctions: string[]
}

export interface DocumentNetwork {
  liquid: LiquidProperties
  /** How the chip's two-phase flow is reduced to one liquid for the pressure budget. */
  approximation: Method
  nodes: { id: string; pressure: Quantity }[]
  channels: DocumentChannel[]
  /** The pressure each inlet needs and the flow it supplies (gauge, Pa and m³/s), whatever its mode. */
  inlets: {
    port: string
    node: string
    mode: 'pressure' | 'flow'
    phase: 'continuous' | 'dispersed'
    pressure: Quantity
    flow: Quantity
  }[]
  outlets: { port: string; node: string; flow: Quantity }[]
  uniformity: DocumentUniformity[]
  margins?: { bondPressure?: Margin; pumpPressure?: Margin }
  solver: { name: string; iterations: number; residual: number }
  /** The coupled drops–flows iteration: tolerance on the relative flow change, iterations, whether it converged. */
  coupling: { method: string; tolerance: number; iterations: number; converged: boolean; change: number }
  /** Per pressure-driven dispersed inlet: the range of its pressure, others held, over which its junctions make drops. */
  operatingWindow: OperatingWindow[]
  warnings: DocumentWarning[]
}

export interface DocumentChannel {
  id: string
  element: string
  from: string
  to: string
  /** Which liquid it carries: a feed line's phase, or the continuous phase with drops ("emulsion") after a junction. */
  liquid: 'continuous' | 'dispersed' | 'emulsion'
  viscosity: Quantity
  flow: Quantity
  /** Effective resistance Δp/Q, the drops' share included. */
  resistance: Quantity
  /** Viscous pressure drop, the drops' share included (an entry barrier is reported on its own). */
  pressureDrop: Quantity
  /** The part of pressureDrop the drops add, and its fraction of the whole. */
  dropletPressureDrop: Quantity
  dropletShare: number
  /** A dispersed arm's capillary entry barrier when it holds one. */
  entryBarrier?: Quantity
}

export interface OperatingWindow {
  port: string
  /** The dispersed pressure at which drops start (the entry barrier) and where they stop (jetting or backflow). */
  from: Quantity
  to: Quantity
  limitedBy: 'jetting' | 'continuous-backflow' | 'pressure-limit'
  /** The set point, for comparison. */
  current: Quantity
  junctions: string[]
}

export interface DocumentForecast {
  document: { name: string }
  operatingPoint: { id: string; name: string }
  network: DocumentNetwork
  junctions: DocumentJunction[]
  /** Every warning of the answer: the network's and the junctions' document-level ones. */
  warnings: DocumentWarning[]
}

export interface DocumentForecastOptions {
  /** Bond and pump limits, Pa gauge. */
  limits?: { bondPressure?: number; pumpPressure?: number }
  /** Exact series (default) or Bruus's approximation. */
  resistanceMethod?: 'series' | 'approximate'
  /** Cap on the coupled drops–flows iterations (default COUPLING_MAX_ITERATIONS); for tests of the fallback. */
  maxCouplingIterations?: number
  /** Liquids and pairs to look ids up in: built-in (default) or merged with a lab's (`mergeLibrary`). */
  library?: LiquidLibrary
}
