export { generateParallelChip, planParallelChip } from './parallel-chip'
export type { ParallelChipOptions, ParallelChipPlan } from './parallel-chip'
export { ladderNonUniformity, rectResistancePerViscosity, sizeManifold } from './resistance'
