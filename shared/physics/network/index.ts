export * from './types'
export { NetworkResolver, solveNetwork, solveNetworkDense } from './solve'
export {
  flowUniformity,
  pressureMargin,
  pumpMargin,
  suctionWarnings,
  VACUUM_GAUGE,
  type Margin,
  type Uniformity,
} from './metrics'
