import { describe, expect, it } from 'vitest'
import type { ChipDocument } from '#shared/schemas/chip'
import { forecastDocument, type DocumentForecast, type DocumentNetwork } from '#shared/physics/document'
import { loadDocument, mixedChip, moveDocument, scaleDocument } from './document-helpers'

/** Every number in a value, depth-first, in a stable order. */
function numbers(value: unknown, out: number[] = []): number[] {
  if (typeof value === 'number') out.push(value)
  else if (Array.isArray(value)) for (const v of value) numbers(v, out)
  else if (value && typeof value === 'object')
    for (const key of Object.keys(value).sort()) numbers((value as Record<string, unknown>)[key], out)
  return out
}

/** Largest relative difference, against the larger magnitude (absolute below `floor`, for values that are ~0). */
function worstRelative(a: number[], b: number[], floor: number): number {
  expect(a.length).toBe(b.length)
  let worst = 0
  for (let i = 0; i < a.length; i++)
    worst = Math.max(worst, Math.abs(a[i]! - b[i]!) / Math.max(Math.abs(a[i]!), Math.abs(b[i]!), floor))
  return worst
}

const junctionNumbers = (answer: DocumentForecast) => numbers(answer.junctions.map(j => j.forecast))
const inletNumbers = (answer: DocumentForecast) =>
  numbers(answer.network.inlets.map(i => [i.pressure.value, i.flow.value]))

describe('document forecast invariants (a layout moved or rotated forecasts the same; scaling as theory says)', () => {
  const cases: [string, ChipDocument][] = [
    ['T-junction fixture', loadDocument('t-junction-basic')],
    ['mixed chip', mixedChip()],
  ]
  for (const [name, doc] of cases) {
    const base = forecastDocument(doc)
    for (const [deg, by] of [
      [0, { x: 12345.6, y: -789 }],
      [90, { x: 0, y: 0 }],
      [33.3, { x: -5000, y: 2500 }],
      [180, { x: 1e5, y: 1e5 }],
    ] as const) {
      it(`${name}: rotated ${deg}° and moved by (${by.x}, ${by.y}) µm changes no forecast (1e-9 relative)`, () => {
        const moved = forecastDocument(moveDocument(doc, deg, by))
        expect(moved.junctions.map(j => j.id)).toEqual(base.junctions.map(j => j.id))
        // Flows that are zero by symmetry come out as ~1e-25 m³/s of rounding: compare against 1e-20 there.
        expect(worstRelative(junctionNumbers(moved), junctionNumbers(base), 1e-20)).toBeLessThan(1e-9)
        expect(worstRelative(inletNumbers(moved), inletNumbers(base), 1e-20)).toBeLessThan(1e-9)
      })
    }
  }

  for (const k of [2, 0.5]) {
    it(`every length × ${k} scales every liquid resistance by 1/k³ at fixed aspect (Bruus 2008, eq. 4.37: R ∝ L/(w h³))`, () => {
      const doc = mixedChip()
      const base = forecastDocument(doc)
      const scaled = forecastDocument(scaleDocument(doc, k))
      expect(scaled.network.channels.map(c => c.id)).toEqual(base.network.channels.map(c => c.id))
      // The liquid's own part, (Δp − Δp_drops)/Q; the drops' part follows the breakup laws, which change with Ca.
      const liquidPart = (c: DocumentNetwork['channels'][number]) =>
        (c.pressureDrop.value - c.dropletPressureDrop.value) / c.flow.value
      for (let i = 0; i < base.network.channels.length; i++) {
        if (base.network.channels[i]!.flow.value === 0) continue
        const ratio = liquidPart(scaled.network.channels[i]!) / liquidPart(base.network.channels[i]!)
        expect(Math.abs(ratio * k ** 3 - 1)).toBeLessThan(1e-6)
      }
    })
    it(`flow-driven T-junction × ${k}: same flows and flow ratio, the liquids' share of inlet pressures × 1/k³`, () => {
      const doc = loadDocument('t-junction-basic')
      const base = forecastDocument(doc)
      const scaled = forecastDocument(scaleDocument(doc, k))
      // Every emulsion channel lies on every inlet's path to the outlet: remove the drops' share.
      const drops = (a: DocumentForecast) =>
        a.network.channels.reduce((sum, c) => sum + Math.abs(c.dropletPressureDrop.value), 0)
      for (let i = 0; i < base.network.inlets.length; i++) {
        const a = base.network.inlets[i]!
        const b = scaled.network.inlets[i]!
        expect(Math.abs((b.pressure.value - drops(scaled)) / (a.pressure.value - drops(base)) - k ** -3)).toBeLessThan(
          1e-9 * k ** -3,
        )
        expect(Math.abs(b.flow.value / a.flow.value - 1)).toBeLessThan(1e-9)
      }
      const fa = base.junctions[0]!.forecast!
      const fb = scaled.junctions[0]!.forecast!
      expect(Math.abs(fb.flowRateRatio.value / fa.flowRateRatio.value - 1)).toBeLessThan(1e-9)
      // Ca = μ Qc/(w h γ) ∝ 1/k² at fixed flow.
      expect(Math.abs(fb.capillaryNumber.value / fa.capillaryNumber.value - k ** -2)).toBeLessThan(1e-9 * k ** -2)
    })
  }
})
