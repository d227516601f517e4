export { fitCorrectionFactor, fitSqueezingAlpha, fitThroughOrigin, type DropletPoint, type Fit } from './fit'
export { tQuantile975 } from './student'
