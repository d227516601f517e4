// The as-built document and its forecast: measured depths and widths replace the drawn ones, and the forecast
// on the as-built chip moves as the published laws say.
import { describe, expect, it } from 'vitest'
import { planParallelChip } from '~~/geometry/arrays'
import { forecastDocument, summarizeForecast } from '#shared/physics/document'
import { STEP_DIAMETER_FACTOR } from '#shared/physics/junction/step'
import type { ChipDocument } from '#shared/schemas/chip'
import type { AsBuiltError } from '#shared/fabrication/asBuilt'
import { applyAsBuilt, measurableWidths } from '#shared/fabrication/asBuilt'
import { asBuiltChanges, describeChange } from '#shared/fabrication/asBuiltDiff'
import type { RevisionSummary } from '#shared/types/designs'
import { chipDocument } from '#shared/schemas/chip'
import { loadDocumentFixture } from '../schemas/load-fixture'

const fixture = (): ChipDocument => chipDocument.parse(loadDocumentFixture('t-junction-basic.json'))

/** A small step-emulsifier chip with its nozzle layer drawn 10 µm deep (tension given: pair not in the library). */
function stepChip(): ChipDocument {
  const doc = planParallelChip({ nozzles: 4, nozzlesPerBank: 4 }).document
  const nozzleLayer = doc.components.find(c => c.kind === 'step-nozzle')!.layerId
  return {
    ...doc,
    layers: doc.layers.map(l => (l.id === nozzleLayer ? { ...l, depth: 10 } : l)),
    operatingPoints: doc.operatingPoints.map(op => ({ ...op, interfacialTensionMNPerM: 3, contactAngleDeg: 150 })),
  }
}
const summary = (doc: ChipDocument): RevisionSummary => {
  const s = summarizeForecast(forecastDocument(doc))
  return {
    junctionKinds: [],
    counts: { channels: 0, components: 0, ports: 0, layers: 0 },
    operatingPoint: s.operatingPoint,
    junctions: s.junctions,
    inlets: s.inlets,
    forecastError: null,
    findings: { errors: 0, warnings: 0, infos: 0 },
    processId: 'p',
  }
}

describe('applyAsBuilt', () => {
  it('a step nozzle made 12 µm deep instead of 10 µm makes drops 1.2 × larger (d ≈ 4 h, Dangla, Kayi & Baroud 2013, PNAS 110, 853)', () => {
    const designed = stepChip()
    const nozzleLayer = designed.components.find(c => c.kind === 'step-nozzle')!.layerId
    const built = applyAsBuilt(designed, { depths: [{ layerId: nozzleLayer, depthUm: 12 }], widths: [] })
    const a = forecastDocument(designed).junctions.filter(j => j.kind === 'step-nozzle')
    const b = forecastDocument(built).junctions.filter(j => j.kind === 'step-nozzle')
    expect(a.length).toBeGreaterThan(0)
    for (const [i, j] of a.entries()) {
      expect(j.forecast!.dropletDiameter.value).toBeCloseTo(STEP_DIAMETER_FACTOR * 10e-6, 12) // 40 µm as drawn
      expect(b[i]!.forecast!.dropletDiameter.value / j.forecast!.dropletDiameter.value).toBeCloseTo(1.2, 9) // 48 µm as built
    }
    // The change table says so, and flags it: +20 % is beyond the step method's ±10 %.
    const changes = asBuiltChanges(summary(designed), summary(built)).filter(c => c.what === 'droplet-diameter')
    expect(changes.every(c => c.exceeds && Math.abs(c.relative! - 0.2) < 1e-3)).toBe(true)
    expect(describeChange(changes[0]!)).toMatch(/40 → 48 µm \(\+20 %\) — beyond the method's uncertainty/)
    // The revision's own document is untouched.
    expect(designed.layers.find(l => l.id === nozzleLayer)!.depth).toBe(10)
  })

  it('replaces measured widths at named features and leaves the rest as drawn', () => {
    const doc = fixture()
    expect(measurableWidths(doc).map(w => `${w.elementId}.${w.field}`)).toEqual([
      'oil-feed.width',
      'water-feed.width',
      'drops-out.width',
      'tj-1.mainWidth',
      'tj-1.inletWidth',
    ])
    const built = applyAsBuilt(doc, {
      depths: [{ layerId: 'ch50', depthUm: 47 }],
      widths: [
        { elementId: 'tj-1', field: 'mainWidth', widthUm: 96 },
        { elementId: 'oil-feed', field: 'width', widthUm: 103 },
      ],
    })
    expect(built.layers[0]!.depth).toBe(47)
    expect(built.components[0] as { mainWidth: number; inletWidth: number }).toMatchObject({
      mainWidth: 96,
      inletWidth: 50,
    })
    expect(built.channels.map(c => c.width)).toEqual([103, 50, 100])
  })

  it('names an unknown layer, element or width field', () => {
    const doc = fixture()
    const fails = (m: Parameters<typeof applyAsBuilt>[1]) => {
      try {
        applyAsBuilt(doc, m)
        return null
      } catch (e) {
        return e as AsBuiltError
      }
    }
    expect(fails({ depths: [{ layerId: 'deep', depthUm: 5 }], widths: [] })).toMatchObject({
      field: 'depths.0.layerId',
      message: 'No layer "deep" on this chip (its layers: ch50)',
    })
    expect(fails({ depths: [], widths: [{ elementId: 'nope', field: 'width', widthUm: 5 }] })).toMatchObject({
      field: 'widths.0.elementId',
    })
    expect(fails({ depths: [], widths: [{ elementId: 'tj-1', field: 'armLength', widthUm: 5 }] })?.message).toBe(
      '"tj-1" has no width "armLength" (measurable: mainWidth, inletWidth)',
    )
  })
})
