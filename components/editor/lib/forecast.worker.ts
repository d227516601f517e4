// The editor's live forecast off the main thread, so a large chip's forecast never holds up a frame. It answers
// the summary (canvas labels) and the forecast without the network's per-node and per-channel lists, which the
// editor does not show and which would cost more to copy back than to compute.
//
// Asked to warm up (the page sends the opened chip while it runs the first forecast itself), it forecasts that
// chip a few times, one run per task, so the JavaScript engine has compiled the forecast code before the person's
// first edit: on the 512-nozzle chip a first edit's run took 56–70 ms cold and 12–18 ms warmed. A request
// arriving meanwhile stops the warm-up and is answered at once.
import type { ChipDocument } from '#shared/schemas/chip'
import { runLiveForecast, type LiveRequest } from './liveRun'

const WARM_UP_RUNS = 6
let warmUp: ReturnType<typeof setTimeout> | undefined

self.onmessage = (e: MessageEvent<LiveRequest>) => {
  clearTimeout(warmUp)
  const doc = e.data.doc as ChipDocument
  if (!e.data.warm) { self.postMessage(runLiveForecast(doc, e.data.seq, e.data.lab)); return }
  let left = WARM_UP_RUNS
  const next = () => { if (left-- > 0) { runLiveForecast(doc, 0); warmUp = setTimeout(next, 0) } }
  warmUp = setTimeout(next, 0)
}
