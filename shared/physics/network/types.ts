// A hydraulic network in SI: channels are resistances between named nodes; sources fix a node's
// pressure (Pa, gauge) or inject a volume flow (m³/s) into it.
export interface NetworkChannel {
  id: string
  from: string
  to: string
  /** Pa·s/m³, finite and > 0. */
  resistance: number
  /**
   * Pa, optional: a pressure the flow must overcome before it moves (a capillary entry barrier), so the
   * channel's flow is (p_from − p_to − offset)/R. Enters Kirchhoff's law as a pair of injected flows ±offset/R.
   */
  offset?: number
}

export type NetworkSource = { node: string; pressure: number } | { node: string; flow: number }

export interface NetworkProblem {
  channels: readonly NetworkChannel[]
  sources: readonly NetworkSource[]
}

export type SolverName =
  | 'pcg-envelope-cholesky'
  | 'pcg-modified-incomplete-cholesky'
  | 'pcg-incomplete-cholesky'
  | 'pcg-jacobi'
  | 'dense-gauss'

export interface NetworkSolution {
  nodeIds: string[]
  /** Pa, indexed like nodeIds. */
  pressure: Float64Array
  /** m³/s from `from` to `to`, indexed like the problem's channels. */
  flow: Float64Array
  /** Per source: the pressure at its node (Pa) and the flow it supplies into the network (m³/s). */
  sources: { node: string; pressure: number; flow: number }[]
  solver: SolverName
  iterations: number
  /** Relative residual ‖b − Ax‖/‖b‖ of the reduced system. */
  residual: number
}
