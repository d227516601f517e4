// Sizes measured at the bench on one junction: they replace the junction's own width fields and its layer's depth,
// on a single junction and on a nozzle of an array, and what cannot be applied is named.
import { describe, expect, it } from 'vitest'
import { planParallelChip } from '~~/geometry/arrays'
import { forecastDocument } from '#shared/physics/document'
import { applyBenchSizes, AsBuiltError, JUNCTION_WIDTH_FIELDS } from '#shared/fabrication/asBuilt'
import { chipDocument, type ChipDocument } from '#shared/schemas/chip'
import { loadDocumentFixture } from '../schemas/load-fixture'

const fixture = (): ChipDocument => chipDocument.parse(loadDocumentFixture('t-junction-basic.json'))

describe('applyBenchSizes', () => {
  it("sets a T-junction's main and inlet widths and its layer depth, and the forecast reads them", () => {
    const doc = fixture()
    const tj = doc.components.find(c => c.kind === 't-junction')!
    const out = applyBenchSizes(doc, undefined, { mainWidthUm: 95, inletWidthUm: 48, depthUm: 45 })
    const after = out.components.find(c => c.id === tj.id) as Record<string, unknown>
    expect(after.mainWidth).toBe(95)
    expect(after.inletWidth).toBe(48)
    expect(out.layers.find(l => l.id === tj.layerId)!.depth).toBe(45)
    // The drawn document is left as it was.
    expect((doc.components.find(c => c.id === tj.id) as Record<string, unknown>).mainWidth).not.toBe(95)
    const inputs = forecastDocument(out).junctions.find(j => j.id === tj.id)!.forecast!.inputs.junction
    expect(inputs.mainWidth.value * 1e6).toBeCloseTo(95, 9)
    expect(inputs.inletWidth.value * 1e6).toBeCloseTo(48, 9)
    expect(inputs.depth.value * 1e6).toBeCloseTo(45, 9)
  })

  it("applies a nozzle's sizes to its array component and refuses an inlet width a step nozzle does not have", () => {
    const doc = planParallelChip({ nozzles: 4, nozzlesPerBank: 4 }).document
    const nozzle = doc.components.find(c => c.kind in JUNCTION_WIDTH_FIELDS)!
    const out = applyBenchSizes(doc, `${nozzle.id}[2]`, { mainWidthUm: 11, depthUm: 6 })
    expect(
      (out.components.find(c => c.id === nozzle.id) as Record<string, unknown>)[
        JUNCTION_WIDTH_FIELDS[nozzle.kind]!.main
      ],
    ).toBe(11)
    expect(out.layers.find(l => l.id === nozzle.layerId)!.depth).toBe(6)
    const refuse = () => applyBenchSizes(doc, nozzle.id, { inletWidthUm: 11 })
    expect(refuse).toThrow(AsBuiltError)
    expect(refuse).toThrow(/has one width, the nozzle's/)
  })

  it('names an unknown junction and a component that is not one', () => {
    const doc = fixture()
    expect(() => applyBenchSizes(doc, 'nope', { depthUm: 40 })).toThrow('No junction "nope" on this chip')
    const layerId = doc.layers[0]!.id
    const withResistor = {
      ...doc,
      components: [
        ...doc.components,
        {
          id: 'sp-1',
          kind: 'serpentine',
          layerId,
          at: { x: 0, y: 0 },
          rotation: 0,
          turns: 2,
          pitch: 200,
          width: 50,
          totalLength: 5000,
        },
      ],
    } as unknown as ChipDocument
    expect(() => applyBenchSizes(withResistor, 'sp-1', { depthUm: 40 })).toThrow('"sp-1" is not a junction')
  })
})
