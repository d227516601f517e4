import { z } from 'zod'
import { flowFocusing } from './flow-focusing'
import { serpentine } from './serpentine'
import { stepArray } from './step-array'
import { stepNozzle } from './step-nozzle'
import { tJunction } from './t-junction'
import { yJunction } from './y-junction'

export const component = z.discriminatedUnion(
  'kind',
  [tJunction, flowFocusing, stepNozzle, stepArray, yJunction, serpentine],
  {
    error: 'Component kind must be one of t-junction, flow-focusing, step-nozzle, step-array, y-junction, serpentine',
  },
)
export type Component = z.infer<typeof component>
export type ComponentKind = Component['kind']

/** Every layer a component draws on. */
export function componentLayerIds(c: Component): string[] {
  if (c.kind === 'step-nozzle') return [c.layerId, c.reservoirLayerId]
  if (c.kind === 'step-array') return [...new Set([c.layerId, c.supplyLayerId, c.reservoirLayerId])]
  return [c.layerId]
}

export type { TJunction } from './t-junction'
export type { FlowFocusing } from './flow-focusing'
export type { StepNozzle } from './step-nozzle'
export type { StepArray } from './step-array'
export type { YJunction } from './y-junction'
export type { Serpentine } from './serpentine'
export { stepArrayLength } from './step-array'
export { serpentineRunLength } from './serpentine'
