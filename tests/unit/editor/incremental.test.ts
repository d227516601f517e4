// The incremental live forecast: the page sends the worker only what an edit changed, the worker keeps the
// previous document and answers; every answer must equal the full forecast of the whole new document.
import { describe, expect, it } from 'vitest'
import { parseChipDocument, rememberParsed, type ChipDocument } from '../../../shared/schemas/chip'
import { actions, runAction } from '../../../shared/editor'
import { generateParallelChip } from '../../../geometry/arrays'
import {
  applyPatch,
  diffDocument,
  focusOn,
  forecastUnchanged,
  runLiveForecast,
  runLiveRules,
  type LiveAnswer,
  type RulesAnswer,
} from '../../../components/editor/lib/liveRun'
import { createForecastApi } from '../../../components/editor/lib/forecastApi'
import { fixtureDocument } from '../../support/factory'

const parsed = (raw: unknown): ChipDocument => {
  const r = parseChipDocument(raw)
  if (!r.ok) throw new Error(r.errors[0]!.message)
  rememberParsed(r.document)
  return r.document
}
const edit = <N extends keyof typeof actions>(
  doc: ChipDocument,
  name: N,
  args: Parameters<(typeof actions)[N]>[1],
): ChipDocument => {
  const r = runAction(doc, actions[name] as never, args as never)
  if (!r.ok) throw new Error(r.refusal.message)
  return r.doc
}
const entries = (p: ReturnType<typeof diffDocument>) =>
  Object.values(p.lists).reduce((n, l) => n + ('all' in l ? Infinity : l.set.length), 0)

describe('document patches', () => {
  const base = parsed(fixtureDocument())
  const edits: Array<[string, (d: ChipDocument) => ChipDocument]> = [
    ['move a junction', d => edit(d, 'move', { ids: [d.components[0]!.id], dx: 100, dy: -50 })],
    [
      'widen a channel',
      d => edit(d, 'setField', { id: d.channels[0]!.id, path: 'width', value: d.channels[0]!.width + 20 }),
    ],
    ['delete a channel', d => edit(d, 'delete', { ids: [d.channels[d.channels.length - 1]!.id] })],
    ['rename the design', d => edit(d, 'setDocumentField', { path: 'name', value: 'Renamed chip' })],
    ['place a mark', d => edit(d, 'placeMark', { position: { x: 100, y: 100 } })],
  ]
  for (const [what, f] of edits) {
    it(`applied to the previous document give the new one exactly: ${what}`, () => {
      const next = f(base)
      const patch = diffDocument(base, next)
      const copy = structuredClone(base) // as the worker holds it: a copy, not the page's objects
      expect(applyPatch(copy, structuredClone(patch))).toEqual(next)
      expect(JSON.stringify(applyPatch(copy, patch))).toBe(JSON.stringify(next)) // same keys in the same order
    })
  }

  it('carry only the elements an edit touched on a 4,096-nozzle chip', () => {
    const big = parsed(generateParallelChip({ nozzles: 4096 }))
    const nozzle = big.components[2000]!.id
    const next = edit(big, 'move', { ids: [nozzle], dx: 20, dy: 0 })
    const patch = diffDocument(big, next)
    expect(entries(patch)).toBeLessThanOrEqual(5) // the nozzle and the four channels attached to it
    expect(JSON.stringify(patch).length).toBeLessThan(5000)
    expect(JSON.stringify(next).length).toBeGreaterThan(1_000_000)
    expect(applyPatch(structuredClone(big), patch)).toEqual(next)
  })
})

describe('forecast reuse', () => {
  it('reuses the forecast only when the forecast cannot change, and the reused answer equals the full forecast', () => {
    const base = parsed(fixtureDocument())
    const marked = edit(base, 'placeMark', { position: { x: 100, y: 100 } })
    expect(forecastUnchanged(base, diffDocument(base, marked))).toBe(true)
    expect(runLiveForecast(marked, 1)).toEqual(runLiveForecast(base, 1))
    const moved = edit(base, 'move', { ids: [base.components[0]!.id], dx: 100, dy: 0 })
    expect(forecastUnchanged(base, diffDocument(base, moved))).toBe(false)
    const renamed = edit(base, 'setDocumentField', { path: 'name', value: 'Renamed chip' })
    expect(forecastUnchanged(base, diffDocument(base, renamed))).toBe(false)
  })
})

describe('the forecast worker', () => {
  const rulesAnswered: RulesAnswer[] = []
  const api = createForecastApi()
  api.onRules(a => rulesAnswered.push(a))

  it('keeps the previous document, applies each patch and answers what a full forecast and rule check of the new document give', async () => {
    const docs = [parsed(generateParallelChip({ nozzles: 16 }))]
    docs.push(edit(docs[0]!, 'move', { ids: [docs[0]!.components[5]!.id], dx: 30, dy: 0 }))
    docs.push(
      edit(docs[1]!, 'setField', {
        id: docs[1]!.channels[3]!.id,
        path: 'width',
        value: docs[1]!.channels[3]!.width * 2,
      }),
    )
    docs.push(edit(docs[2]!, 'placeMark', { position: { x: 100, y: 100 } }))
    const focus = docs[0]!.components[5]!.id
    // Each request crosses a structured clone, as it does to the real worker.
    const answers: LiveAnswer[] = [
      api.run(structuredClone({ seq: 1, doc: docs[0], processId: 'film-mask-soft-litho', focus })),
    ]
    for (let k = 1; k < docs.length; k++)
      answers.push(
        api.run(
          structuredClone({
            seq: k + 1,
            patch: diffDocument(docs[k - 1]!, docs[k]!),
            processId: 'film-mask-soft-litho',
            focus,
          }),
        ),
      )
    await new Promise(r => setTimeout(r, 20))
    expect(answers.map(a => a.seq)).toEqual([1, 2, 3, 4])
    for (const [k, a] of answers.entries()) {
      const full = runLiveForecast(docs[k]!, k + 1)
      expect(a).toEqual({ ...full, forecast: focusOn(full.forecast, focus) })
      expect(a.forecast!.junctions.length).toBe(1) // the focused nozzle's junction, the same as in the full forecast
      expect(a.forecast!.junctions).toEqual(full.forecast!.junctions.filter(j => j.element === focus))
    }
    expect(answers[2]!.summary).not.toEqual(answers[1]!.summary)
    // Another selection: its junctions from the last forecast, as the full forecast has them.
    const other = docs[3]!.components[9]!.id
    const moved = api.refocus(4, other)
    expect(moved.junctions).toEqual(runLiveForecast(docs[3]!, 4).forecast!.junctions.filter(j => j.element === other))
    // Rules run after the forecast in their own task and only for the newest document.
    expect(rulesAnswered.map(r => r.seq)).toEqual([4])
    expect(rulesAnswered[0]!.findings).toEqual(runLiveRules(docs[3]!, 'film-mask-soft-litho'))
  })
})
