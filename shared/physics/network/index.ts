export * from './types'
export { solveNetwork, solveNetworkDense } from './solve'
export { flowUniformity, pressureMargin, type Margin, type Uniformity } from './metrics'
