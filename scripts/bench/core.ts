// The hot functions the benchmarks time, re-exported as one entry so `importShipped` can bundle them as they ship.
export { exportDxf } from '../../geometry/dxf'
export { buildOutlines, mergePieces, mergePiecesSingleSweep } from '../../geometry/outlines'
export { checkDesignRules } from '../../geometry/rules'
export { forecastDocument } from '../../shared/physics/document'
