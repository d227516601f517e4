// What the editor's forecast worker (forecast.worker.ts) exposes through comlink: the live forecast and rule
// checks off the main thread, so a large chip's forecast never holds up a frame. `run` answers the summary (canvas
// labels) and the forecast without the network's per-node and per-channel lists, which the editor does not show
// and which would cost more to copy back than to compute, and with only the junctions of the focused (selected)
// element; then, in a task of its own, the design-rule findings of the same document go to the `onRules` callback
// (dropped when a newer request arrives first).
//
// It keeps the document of the previous request: after the first one the page sends only a patch of what the
// edit changed (liveRun.ts, diffDocument), and when only marks or the chip outline changed, the previous forecast
// is answered again without solving (the forecast never reads them). The lab's own library (liquids, pairs,
// processes) comes with the first request and again whenever it changes.
//
// Asked to warm up (`warm`: the page sends the opened chip while it runs the first forecast itself), it forecasts
// that chip a few times, one run per task, so the JavaScript engine has compiled the forecast code before the
// person's first edit: on the 512-nozzle chip a first edit's run took 56–70 ms cold and 12–18 ms warmed. A request
// arriving meanwhile stops the warm-up and is answered at once.
import type { ChipDocument } from '#shared/schemas/chip'
import {
  applyPatch,
  focusOn,
  forecastUnchanged,
  runLiveForecast,
  runLiveRules,
  type FocusAnswer,
  type LiveAnswer,
  type LiveLab,
  type LiveRequest,
  type RulesAnswer,
} from './liveRun'

const WARM_UP_RUNS = 6

export function createForecastApi() {
  let warmUp: ReturnType<typeof setTimeout> | undefined
  let rules: ReturnType<typeof setTimeout> | undefined
  let doc: ChipDocument | null = null
  let last: LiveAnswer | null = null
  /** The lab's library of the last request that sent one (null: built-in only). */
  let lab: LiveLab | null = null
  let answerRules: (a: RulesAnswer) => unknown = () => {}

  /** Takes the request's document (whole or patch) and library; false when a patch has no document to apply to. */
  const take = (req: LiveRequest) => {
    clearTimeout(warmUp)
    clearTimeout(rules)
    const before = doc
    const labChanged = req.lab !== undefined && JSON.stringify(req.lab) !== JSON.stringify(lab)
    if (req.lab !== undefined) lab = req.lab
    doc = req.doc ?? (before && req.patch ? applyPatch(before, req.patch) : null)
    return { before, labChanged }
  }
  const lost = (seq: number): LiveAnswer => ({
    seq,
    forecast: null,
    summary: null,
    error: 'The forecast worker lost its document: reload the page',
  })

  return {
    /** Where the rule findings of each request go, after its forecast. */
    onRules(f: (a: RulesAnswer) => unknown) {
      answerRules = f
    },
    run(req: LiveRequest): LiveAnswer {
      const { before, labChanged } = take(req)
      if (!doc) return lost(req.seq)
      const d = doc
      const same = !!(!labChanged && last && before && req.patch && !last.error && forecastUnchanged(before, req.patch))
      last = same ? { ...last!, seq: req.seq } : runLiveForecast(d, req.seq, lab)
      if (req.processId !== undefined)
        rules = setTimeout(() => answerRules({ seq: req.seq, findings: runLiveRules(d, req.processId, lab) }), 0)
      // The page gets the junctions of the focused element only; the rest stay here for a later `refocus`.
      return { ...last, forecast: focusOn(last.forecast, req.focus) }
    },
    /** Keeps the document and warms up on it; the opened chip's findings first (the page shows them). */
    warm(req: LiveRequest): void {
      take(req)
      if (!doc) return
      const d = doc
      if (req.processId !== undefined) answerRules({ seq: req.seq, findings: runLiveRules(d, req.processId, lab) })
      let left = WARM_UP_RUNS
      const next = () => {
        if (left-- > 0) {
          runLiveForecast(d, 0, lab)
          warmUp = setTimeout(next, 0)
        }
      }
      warmUp = setTimeout(next, 0)
      last = null
    },
    /** The junctions of another element from the last forecast. */
    refocus(seq: number, focus: string | null): FocusAnswer {
      return { seq, focus, junctions: focusOn(last?.forecast ?? null, focus)?.junctions ?? [] }
    },
  }
}
export type ForecastApi = ReturnType<typeof createForecastApi>
