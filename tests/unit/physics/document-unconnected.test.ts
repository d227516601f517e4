import { describe, expect, it } from 'vitest'
import { requireChipDocument } from '#shared/schemas/chip'
import { forecastDocument } from '#shared/physics/document'
import { loadDocument } from './document-helpers'

// A part placed but not yet wired must not stop the whole chip's forecast (the editor places parts one at a
// time): it is left out with a warning naming it, and the connected junction is forecast exactly as before.
describe('a component no channel reaches', () => {
  it('is left out with a warning, and changes nothing else', () => {
    const base = loadDocument('t-junction-basic')
    const withLoose = requireChipDocument({
      ...base,
      components: [
        ...base.components,
        {
          id: 'tj-spare',
          kind: 't-junction',
          position: { x: 5000, y: 6000 },
          rotation: 0,
          layerId: 'ch50',
          mainWidth: 100,
          inletWidth: 50,
          armLength: 200,
        },
      ],
    })
    const before = forecastDocument(base)
    const after = forecastDocument(withLoose)
    expect(after.warnings).toContainEqual(
      expect.objectContaining({ code: 'component-unconnected', element: 'tj-spare' }),
    )
    expect(after.junctions.map(j => j.id)).toEqual(['tj-1'])
    expect(after.junctions[0]!.forecast!.dropletDiameter.value).toBe(
      before.junctions[0]!.forecast!.dropletDiameter.value,
    )
    expect(before.warnings.some(w => w.code === 'component-unconnected')).toBe(false)
  })
})
