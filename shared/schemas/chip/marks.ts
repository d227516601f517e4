import { z } from 'zod'
import { safeText } from '../text'
import { CHIP_LIMITS as L } from './limits'
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
  layerIds: z
    .array(elementId)
    .max(L.layersPerMark, { error: `A mark can be on at most ${L.layersPerMark} layers` })
    .default([]),
})

const text = z.object({
  id: elementId,
  kind: z.literal('text'),
  position: point,
  text: safeText({ error: 'Text mark must be a string' }, 'Text mark')
    .min(1, { error: 'Text mark must not be empty' })
    .max(L.textChars, { error: `Text mark must be at most ${L.textChars} characters` }),
  height: positiveUm('Text height', L.textHeightUm),
  layerIds: z
    .array(elementId)
    .max(L.layersPerMark, { error: `A mark can be on at most ${L.layersPerMark} layers` })
    .default([]),
})

export const mark = z.discriminatedUnion('kind', [cross, text])
export type Mark = z.infer<typeof mark>
