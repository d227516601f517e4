// The editor's live forecast and rule checks off the main thread, so a large chip's forecast never holds up a
// frame. It answers the summary (canvas labels) and the forecast without the network's per-node and per-channel
// lists, which the editor does not show and which would cost more to copy back than to compute, and with only the
// junctions of the focused (selected) element; then, in a task of its own, the design-rule findings of the same
// document (dropped when a newer edit arrives first).
//
// It keeps the document of the previous request: after the first one the page sends only a patch of what the
// edit changed (liveRun.ts, diffDocument), and when only marks or the chip outline changed, the previous forecast
// is answered again without solving (the forecast never reads them). The lab's own library (liquids, pairs,
// processes) comes with the first request and again whenever it changes.
//
// Asked to warm up (the page sends the opened chip while it runs the first forecast itself), it forecasts that
// chip a few times, one run per task, so the JavaScript engine has compiled the forecast code before the person's
// first edit: on the 512-nozzle chip a first edit's run took 56–70 ms cold and 12–18 ms warmed. A request
// arriving meanwhile stops the warm-up and is answered at once.
import type { ChipDocument } from '#shared/schemas/chip'
import {
  applyPatch,
  focusOn,
  forecastUnchanged,
  runLiveForecast,
  runLiveRules,
  type FocusAnswer,
  type FocusRequest,
  type LiveAnswer,
  type LiveLab,
  type LiveRequest,
  type RulesAnswer,
} from './liveRun'

const WARM_UP_RUNS = 6
let warmUp: ReturnType<typeof setTimeout> | undefined
let rules: ReturnType<typeof setTimeout> | undefined
let doc: ChipDocument | null = null
let last: LiveAnswer | null = null
/** The lab's library of the last request that sent one (null: built-in only). */
let lab: LiveLab | null = null

self.onmessage = (e: MessageEvent<LiveRequest | FocusRequest>) => {
  if ('refocus' in e.data) {
    const f = e.data
    self.postMessage({
      seq: f.seq,
      focus: f.focus,
      junctions: focusOn(last?.forecast ?? null, f.focus)?.junctions ?? [],
    } satisfies FocusAnswer)
    return
  }
  clearTimeout(warmUp)
  clearTimeout(rules)
  const req = e.data
  const before = doc
  const labChanged = req.lab !== undefined && JSON.stringify(req.lab) !== JSON.stringify(lab)
  if (req.lab !== undefined) lab = req.lab
  doc = req.doc ?? (before && req.patch ? applyPatch(before, req.patch) : null)
  if (!doc) {
    self.postMessage({
      seq: req.seq,
      forecast: null,
      summary: null,
      error: 'The forecast worker lost its document: reload the page',
    } satisfies LiveAnswer)
    return
  }
  const d = doc
  if (req.warm) {
    // The opened chip's findings first (the page shows them), then the warm-up runs.
    if (req.processId !== undefined)
      self.postMessage({ seq: req.seq, findings: runLiveRules(d, req.processId, lab) } satisfies RulesAnswer)
    let left = WARM_UP_RUNS
    const next = () => {
      if (left-- > 0) {
        runLiveForecast(d, 0, lab)
        warmUp = setTimeout(next, 0)
      }
    }
    warmUp = setTimeout(next, 0)
    last = null
    return
  }
  const same = !!(!labChanged && last && before && req.patch && !last.error && forecastUnchanged(before, req.patch))
  last = same ? { ...last!, seq: req.seq } : runLiveForecast(d, req.seq, lab)
  // The page gets the junctions of the focused element only; the rest stay here for a later focus request.
  self.postMessage({ ...last, forecast: focusOn(last.forecast, req.focus) } satisfies LiveAnswer)
  if (req.processId !== undefined)
    rules = setTimeout(
      () => self.postMessage({ seq: req.seq, findings: runLiveRules(d, req.processId, lab) } satisfies RulesAnswer),
      0,
    )
}
