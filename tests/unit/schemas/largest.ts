// The largest chip document the schema accepts, as far as work goes: every drawn piece the document limit
// allows (CHIP_LIMITS.pieces), spent on the most expensive kind — step arrays whose nozzles touch their supply
// channel on one layer, so each array is one long ladder for the outline merge and the rules. Used by the
// bounds tests, the API's event-loop test and `npm run bench`.
import { CHIP_LIMITS, documentPieceCount, type ChipDocumentInput } from '#shared/schemas/chip'

export function largestAcceptedDocument(): ChipDocumentInput {
  const perArray = CHIP_LIMITS.nozzlesPerArray
  const pitch = 10
  const room = CHIP_LIMITS.pieces - 3 // the three punches
  const arrays = Math.ceil(room / (perArray + 2))
  const components = Array.from({ length: arrays }, (_, i) => ({
    kind: 'step-array' as const,
    id: `array-${i + 1}`,
    layerId: 'nozzle',
    supplyLayerId: 'nozzle',
    reservoirLayerId: 'deep',
    position: { x: -180_000 + i * 60_000, y: -50_000 },
    rotation: 0,
    nozzleCount: Math.min(perArray, room - i * (perArray + 2) - 2),
    pitch,
    nozzleWidth: 5,
    nozzleLength: 40,
    supplyWidth: 200,
    reservoirWidth: 400,
    margin: 50,
  }))
  const doc: ChipDocumentInput = {
    version: 1,
    name: 'Largest accepted chip',
    units: 'um',
    layers: [
      { id: 'nozzle', name: 'Nozzles', depth: 10 },
      { id: 'deep', name: 'Reservoir', depth: 100 },
    ],
    ports: [
      {
        id: 'oil',
        kind: 'inlet',
        position: { x: -190_000, y: 150_000 },
        punchDiameter: 10_000,
        layerId: 'deep',
        feed: { phase: 'continuous' },
      },
      {
        id: 'water',
        kind: 'inlet',
        position: { x: -190_000, y: -150_000 },
        punchDiameter: 10_000,
        layerId: 'nozzle',
        feed: { phase: 'dispersed' },
      },
      { id: 'out', kind: 'outlet', position: { x: 190_000, y: 150_000 }, punchDiameter: 10_000, layerId: 'deep' },
    ],
    channels: [],
    components,
    outline: { kind: 'rectangle', corner: { x: -200_000, y: -200_000 }, width: 400_000, height: 400_000 },
    marks: [],
    operatingPoints: [],
  }
  const pieces = documentPieceCount(doc as never)
  if (pieces > CHIP_LIMITS.pieces) throw new Error(`largestAcceptedDocument has ${pieces} pieces, over the limit`)
  return doc
}
