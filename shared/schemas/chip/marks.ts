import { z } from 'zod'
import { elementId, point } from './primitives'
import { positiveUm } from './units'

// Alignment marks and text. They always go to the DXF's marks layer; `layerIds` also draws them on those
// channel layers (a cross printed on both masks is what aligns a two-layer mould).
const cross = z.object({
  id: elementId,
  kind: z.literal('cross'),
  position: point,
  size: positiveUm('Alignment mark size'),
  lineWidth: positiveUm('Alignment mark line width'),
  layerIds: z.array(elementId).default([]),
})

const text = z.object({
  id: elementId,
  kind: z.literal('text'),
  position: point,
  text: z.string().min(1, { error: 'Text mark must not be empty' }).max(200),
  height: positiveUm('Text height'),
  layerIds: z.array(elementId).default([]),
})

export const mark = z.discriminatedUnion('kind', [cross, text])
export type Mark = z.infer<typeof mark>
