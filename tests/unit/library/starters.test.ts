// Every starter chip forecasts cleanly on the built-in liquids: a valid document, a forecast at every junction in
// the kind's intended regime, no warning but the method's own standing notes (the flow-focusing size law and the
// step regime thresholds are low-confidence by design: shared/physics/junction), and no design-rule error.
import { describe, expect, it } from 'vitest'
import { forecastDocument, summarizeForecast } from '#shared/physics/document'
import { BUILT_IN_PROCESSES, checkDesignRules } from '~~/geometry/rules'
import { STARTERS, starterDocument } from '../../../server/services/starterDocument'
import { demoDesigns } from '../../../server/db/demo-designs'

const EXPECTED = {
  't-junction': { regime: 'squeezing', standing: [] as string[], valid: true },
  'flow-focusing': { regime: 'squeezing', standing: ['flow-focusing-low-confidence'], valid: false },
  'step-emulsifier': { regime: 'step-emulsification', standing: ['regime-indicative'], valid: false },
} as const

describe('starter chips', () => {
  for (const kind of STARTERS) {
    it(`${kind}: a forecast at every junction in its regime, no other warning, no rule error`, () => {
      const doc = starterDocument(`Starter ${kind}`, kind)
      const answer = forecastDocument(doc)
      expect(answer.junctions).toHaveLength(1)
      const expected = EXPECTED[kind]
      for (const j of answer.junctions) {
        const f = j.forecast
        expect(f, `${kind} ${j.id}: ${JSON.stringify(answer.warnings)}`).not.toBeNull()
        expect(f!.regime.value).toBe(expected.regime)
        expect(
          (f!.warnings ?? []).map(w => w.code).filter(c => !(expected.standing as readonly string[]).includes(c)),
        ).toEqual([])
        expect(f!.frequency.value).toBeGreaterThan(0)
      }
      expect(
        answer.warnings.map(w => w.code).filter(c => !(expected.standing as readonly string[]).includes(c)),
      ).toEqual([])
      // The T-junction's squeezing law is a published one, so its stored summary is marked valid.
      expect(summarizeForecast(answer).junctions.every(j => j.valid)).toBe(expected.valid)
      for (const process of BUILT_IN_PROCESSES) {
        const errors = checkDesignRules(doc, process).filter(f => f.severity === 'error')
        expect(errors, `${kind} under ${process.id}`).toEqual([])
      }
    })
  }

  it('the step emulsifier makes drops of about four nozzle depths (d ≈ 4h for a wide, shallow nozzle: Dangla, Kayi & Baroud 2013, PNAS 110, 853)', () => {
    const d = forecastDocument(starterDocument('Step', 'step-emulsifier')).junctions[0]!.forecast!.dropletDiameter.value
    expect(d / 10e-6).toBeGreaterThan(3.5)
    expect(d / 10e-6).toBeLessThan(4.5)
  })
})

describe('names in the starter and demo chips read as the trade writes them', () => {
  // "40 um" on screen is the ASCII stand-in for µm that a person would never type in a name (issue 16, seen on the
  // revision page and in the compare table).
  const names = (doc: { name?: string; operatingPoints: Array<{ name: string }>; layers: Array<{ name: string }> }) => [
    doc.name ?? '',
    ...doc.operatingPoints.map(o => o.name),
    ...doc.layers.map(l => l.name),
  ]
  it('no "um" for micrometres in a starter or demo chip\'s names', () => {
    const all = [
      ...STARTERS.map(k => starterDocument(`Starter ${k}`, k)),
      ...demoDesigns().flatMap(d => d.revisions.map(r => r.document)),
    ]
    const asciiMicro = all.flatMap(d => names(d as never)).filter(n => /\d\s?um\b/.test(n))
    expect(asciiMicro).toEqual([])
    expect(all.length).toBeGreaterThan(STARTERS.length)
  })
})
