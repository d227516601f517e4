export { exportDxf, dxfLayers } from './export'
export type { DxfOptions, DxfLayerSummary } from './export'
export { depthLayerName, OUTLINE_LAYER, MARKS_LAYER_NAME, TEXT_LAYER } from './layer-names'
