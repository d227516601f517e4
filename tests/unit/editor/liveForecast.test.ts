import { describe, expect, it } from 'vitest'
import { effectScope, nextTick, ref, shallowRef } from 'vue'
import { ChannelWorker } from '../../support/channelWorker'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import { useLiveForecast } from '../../../components/editor/lib/liveForecast'
import { resolveProcess, type Finding } from '../../../geometry/rules'
import { runLiveRules, type LiveRequest, type RulesAnswer } from '../../../components/editor/lib/liveRun'
import { createForecastApi, type ForecastApi } from '../../../components/editor/lib/forecastApi'
import { fixtureDocument } from '../../support/factory'

const doc = (): ChipDocument => {
  const r = parseChipDocument(fixtureDocument())
  if (!r.ok) throw new Error('fixture')
  return r.document
}
/** The fixture with the outlet channel 10 µm wide: under the film-mask minimum feature (20 µm), over the chrome-mask one (3 µm). */
const narrow = (): ChipDocument => {
  const d = doc()
  return { ...d, channels: d.channels.map(c => (c.id === 'drops-out' ? { ...c, width: 10 } : c)) }
}
const wait = (ms: number) => new Promise(r => setTimeout(r, ms))

describe('live design-rule findings', () => {
  it('use the process the design names, the first built-in one only when it names none we know', () => {
    expect(resolveProcess('chrome-mask-soft-litho').id).toBe('chrome-mask-soft-litho')
    expect(resolveProcess('film-mask-soft-litho').id).toBe('film-mask-soft-litho')
    expect(resolveProcess('no-such-process').id).toBe('film-mask-soft-litho')
    expect(resolveProcess(null).id).toBe('film-mask-soft-litho')
  })

  it('a 10 µm channel is a finding on a film mask and none on a chrome mask, and follows a change of process', async () => {
    const processId = ref<string | null>('film-mask-soft-litho')
    const scope = effectScope()
    const { findings } = scope.run(() => useLiveForecast(ref(narrow()), { processId }))!
    await wait(200)
    const about = () =>
      findings.value.filter(
        f => f.elements.includes('drops-out') && /minimum|feature|narrow/i.test(`${f.rule} ${f.message}`),
      )
    expect(about().length).toBeGreaterThan(0)
    processId.value = 'chrome-mask-soft-litho'
    await nextTick()
    await wait(200)
    expect(about()).toEqual([])
    scope.stop()
  })
})

describe('live forecast runs', () => {
  it("the editor's lean answer keeps what the editor shows: same summary, inlets and junctions as the full forecast", async () => {
    const { forecastDocument, summarizeForecast } = await import('../../../shared/physics/document')
    const { runLiveForecast } = await import('../../../components/editor/lib/liveRun')
    const full = forecastDocument(doc())
    const lean = runLiveForecast(doc(), 1)
    expect(lean.summary).toEqual(summarizeForecast(full))
    expect(lean.forecast!.junctions).toEqual(full.junctions)
    expect(lean.forecast!.network.inlets).toEqual(full.network.inlets)
    expect(lean.forecast!.network.channels).toEqual([])
  })

  it('edits made while a run is under way are folded into one run of the newest document, which the panel ends on', async () => {
    const { runLiveForecast } = await import('../../../components/editor/lib/liveRun')
    // The first run answers late, as a worker busy with a big chip would.
    const runner = (d: ChipDocument, seq: number) =>
      new Promise<ReturnType<typeof runLiveForecast>>(r =>
        setTimeout(() => r(runLiveForecast(d, seq)), seq === 1 ? 80 : 5),
      )
    const d = ref(doc())
    const scope = effectScope()
    const { live } = scope.run(() => useLiveForecast(d, { runner }))!
    await wait(10)
    const faster = {
      ...d.value,
      operatingPoints: d.value.operatingPoints.map(o => ({
        ...o,
        inlets: o.inlets.map(i => (i.portId === 'oil-in' ? { ...i, value: i.value * 3 } : i)),
      })),
    }
    d.value = faster
    await wait(150)
    const expected = runLiveForecast(faster, 0).summary!.junctions[0]!.dropletDiameterUm
    expect(live.value.summary!.junctions[0]!.dropletDiameterUm).toBe(expected)
    expect(expected).not.toBe(runLiveForecast(doc(), 0).summary!.junctions[0]!.dropletDiameterUm)
    scope.stop()
  })
})

describe('progress of a slow run', () => {
  it('says "updating" only while a run takes longer than 150 ms', async () => {
    const { runLiveForecast } = await import('../../../components/editor/lib/liveRun')
    const runner = (d: ChipDocument, seq: number) =>
      new Promise<ReturnType<typeof runLiveForecast>>(r => setTimeout(() => r(runLiveForecast(d, seq)), 300))
    const scope = effectScope()
    const { slow, live } = scope.run(() => useLiveForecast(ref(doc()), { runner }))!
    await wait(50)
    expect(slow.value).toBe(false)
    await wait(150)
    expect(slow.value).toBe(true)
    await wait(200)
    expect(slow.value).toBe(false)
    expect(live.value.summary).not.toBeNull()
    scope.stop()
  })
})

/**
 * A stand-in for the browser's Worker: the real worker API (forecastApi.ts) exposed through comlink on a
 * MessageChannel, recording what each `run` and `warm` is sent.
 */
const fakeWorker = (sent: Array<{ seq: number; warm: boolean; whole: boolean }>, stale?: Finding) =>
  class FakeWorker extends ChannelWorker {
    constructor() {
      const real = createForecastApi()
      const record = (req: LiveRequest, warm: boolean) => sent.push({ seq: req.seq, warm, whole: !!req.doc })
      let rules: (a: RulesAnswer) => unknown = () => {}
      const api: ForecastApi = {
        ...real,
        onRules: f => ((rules = f), real.onRules(f)),
        run: req => {
          record(req, false)
          // `stale`: the previous request's findings arrive late, after this one's.
          if (stale) setTimeout(() => rules({ seq: req.seq - 1, findings: [stale] }), 20)
          return real.run(req)
        },
        warm: req => (record(req, true), real.warm(req)),
      }
      super(api)
    }
  }

describe('with a worker', () => {
  it('the first forecast runs in the page while the worker warms up on the same chip; later edits go to the worker', async () => {
    const sent: Array<{ seq: number; warm: boolean; whole: boolean }> = []
    const g = globalThis as { Worker?: unknown }
    const before = g.Worker
    g.Worker = fakeWorker(sent)
    try {
      // Held as the editor's store holds it (a shallow ref: the document's objects are sent as they are).
      const d = shallowRef(doc())
      const scope = effectScope()
      const { live } = scope.run(() => useLiveForecast(d))!
      await wait(30)
      expect(live.value.summary).not.toBeNull()
      expect(sent).toEqual([{ seq: 1, warm: true, whole: true }])
      d.value = { ...d.value, name: 'Renamed' }
      await wait(30)
      expect(sent.at(-1)).toEqual({ seq: 2, warm: false, whole: false }) // a patch, not the whole document
      expect(live.value.forecast!.document.name).toBe('Renamed')
      scope.stop()
    } finally {
      g.Worker = before
    }
  })
})

describe('answers of an older request', () => {
  it('rule findings of an older document arriving after the newer one do not replace them', async () => {
    const stale = { id: 'stale-finding', severity: 'error', message: 'from an older document' } as unknown as Finding
    const g = globalThis as { Worker?: unknown }
    const before = g.Worker
    g.Worker = fakeWorker([], stale)
    try {
      const d = shallowRef(narrow())
      const scope = effectScope()
      const { findings } = scope.run(() => useLiveForecast(d, { processId: ref('film-mask-soft-litho') }))!
      await wait(30)
      const edited = { ...d.value, name: 'Renamed' }
      d.value = edited
      await wait(80)
      expect(findings.value.map(f => f.id)).not.toContain('stale-finding')
      expect(findings.value).toEqual(runLiveRules(edited, 'film-mask-soft-litho'))
      expect(findings.value.length).toBeGreaterThan(0)
      scope.stop()
    } finally {
      g.Worker = before
    }
  })
})
