// The live forecast of the working document: forecast + summary right after every committed edit (a drag commits
// once, on release), computed in a Web Worker (lib/forecast.worker.ts) so the canvas keeps its frames; rule
// findings a moment later (they cost more on a large chip); and the canvas labels built from both.
import { onScopeDispose, shallowRef, toRaw, watch, type Ref } from 'vue'
import type { ChipDocument } from '#shared/schemas/chip'
import type { DocumentForecast, ForecastSummary } from '#shared/physics/document'
import type { Finding } from '~~/geometry/rules'
import type { LabLiquidsData } from '#shared/physics/liquids'
import type { ViewerFinding } from '../../viewer/lib/markers'
import { proxy, wrap } from 'comlink'
import type { ForecastApi } from './forecastApi'
import {
  diffDocument,
  runLiveForecast,
  runLiveRules,
  type FocusAnswer,
  type LiveAnswer,
  type LiveLab,
  type LiveRequest,
  type RulesAnswer,
} from './liveRun'

export type { LiveLab } from './liveRun'

export interface LiveForecast {
  forecast: DocumentForecast | null
  summary: ForecastSummary | null
  error: string | null
  at: number
}

/** Runs one forecast: in a Web Worker in the browser, in the calling thread where there is none (tests, old browsers). */
export type ForecastRunner = (doc: ChipDocument, seq: number, lab?: LabLiquidsData | null) => Promise<LiveAnswer>

/**
 * The Web Worker (forecast.worker.ts, called through comlink): forecasts, then checks the rules of the same
 * document and answers them through `onRules`; can be asked to warm up on a document. It keeps the document it was
 * last sent, so each later request carries only a patch of what changed (liveRun.ts).
 */
interface WorkerRunner {
  run: (
    doc: ChipDocument,
    seq: number,
    processId: string | null,
    focus: string | null,
    lab: LiveLab | null,
  ) => Promise<LiveAnswer>
  warm: (doc: ChipDocument, seq: number, processId: string | null, lab: LiveLab | null) => void
  /** The junctions of another element from the worker's last forecast (null: the worker is gone). */
  refocus: (seq: number, focus: string | null) => Promise<FocusAnswer | null>
  onRules: (f: (a: RulesAnswer) => void) => void
  stop: () => void
}

function workerRunner(): WorkerRunner | null {
  if (typeof Worker === 'undefined') return null
  let worker: Worker
  try {
    worker = new Worker(new URL('./forecast.worker.ts', import.meta.url), { type: 'module' })
  } catch {
    return null
  }
  const api = wrap<ForecastApi>(worker)
  const waiting = new Map<number, { doc: ChipDocument; lab: LiveLab | null; done: (a: LiveAnswer) => void }>()
  /** The document the worker holds (the last one sent), for the next patch. */
  let sent: ChipDocument | null = null
  /** The lab library the worker holds (undefined: none sent yet). */
  let sentLab: LiveLab | null | undefined
  // A worker that fails to load or crashes: every waiting run is answered in the page itself, and so are later ones.
  let broken = false
  const inPage = (seq: number) => {
    const w = waiting.get(seq)
    waiting.delete(seq)
    w?.done(runLiveForecast(w.doc, seq, w.lab))
  }
  worker.addEventListener('error', () => {
    broken = true
    for (const seq of [...waiting.keys()]) inPage(seq)
  })
  const request = (doc: ChipDocument, lab: LiveLab | null, req: Omit<LiveRequest, 'doc' | 'patch' | 'lab'>) => {
    const raw = toRaw(doc)
    const withLab = lab !== sentLab ? { lab: lab ? toRaw(lab) : null } : {}
    const out: LiveRequest = { ...req, ...withLab, ...(sent ? { patch: diffDocument(sent, raw) } : { doc: raw }) }
    sent = raw
    sentLab = lab
    return out
  }
  return {
    run: (doc, seq, processId, focus, lab) =>
      new Promise(done => {
        if (broken) {
          done(runLiveForecast(doc, seq, lab))
          return
        }
        waiting.set(seq, { doc, lab, done })
        api.run(request(doc, lab, { seq, processId, focus })).then(
          a => {
            waiting.get(seq)?.done(a)
            waiting.delete(seq)
          },
          () => inPage(seq),
        )
      }),
    refocus: async (seq, focus) => (broken ? null : api.refocus(seq, focus)),
    warm: (doc, seq, processId, lab) => {
      if (!broken) void api.warm(request(doc, lab, { seq, processId }))
    },
    onRules: f => {
      void api.onRules(proxy(f))
    },
    stop: () => worker.terminate(),
  }
}
const inThread: ForecastRunner = async (doc, seq, lab) => runLiveForecast(doc, seq, lab)

/** Up to this many ports, components and channels the first forecast runs in the page (the 512-nozzle chip has 1,540). */
const IN_PAGE_FIRST_MAX = 2000
const elementCount = (d: ChipDocument) => d.ports.length + d.components.length + d.channels.length

/** A run taking longer than this shows "updating" (a shorter one would only flicker). */
const SLOW_MS = 150

/**
 * `focus`: the element whose junctions `live.forecast.junctions` must hold (the selected part); from the worker
 * the forecast carries that element's junctions only (focusOn in liveRun.ts), the summary every junction. `lab`:
 * the lab's own liquids, pairs and processes (GET /api/v1/liquids?lab=); null → built-in only.
 */
export function useLiveForecast(
  doc: Ref<ChipDocument | null>,
  opts: {
    delayMs?: number
    processId?: Ref<string | null>
    runner?: ForecastRunner
    focus?: Ref<string | null>
    lab?: Ref<LiveLab | null>
  } = {},
) {
  const live = shallowRef<LiveForecast>({ forecast: null, summary: null, error: null, at: 0 })
  const findings = shallowRef<Finding[]>([])
  /** True while a run has taken longer than SLOW_MS, so the panel can say the numbers are being updated. */
  const slow = shallowRef(false)
  let slowTimer: ReturnType<typeof setTimeout> | undefined
  const worker = opts.runner ? null : workerRunner()
  const processId = () => opts.processId?.value ?? null
  let seq = 0
  // Rule findings: from the worker, for the newest document it was sent; without one, in the page a moment after
  // the forecast (they cost more on a large chip).
  let rulesFor = 0
  worker?.onRules(a => {
    if (a.seq === rulesFor) findings.value = a.findings
  })
  // The seq of the forecast shown, and whether it came from the worker (then it holds the focused junctions only).
  let shown = 0
  let fromWorker = false
  let sentFocus: string | null = null
  const focus = () => opts.focus?.value ?? null
  // Another selection: its junctions from the worker's last forecast, kept if that forecast is still the one shown.
  const refocus = async (n: number, id: string | null) => {
    const a = await worker!.refocus(n, id)
    const f = live.value.forecast
    if (a && a.seq === shown && f && a.focus === focus())
      live.value = { ...live.value, forecast: { ...f, junctions: a.junctions } }
  }
  // On a small chip the first forecast runs in the page, right after the chip is drawn, while the worker loads,
  // checks the rules and warms up on the same document; every later one runs in the worker. A large chip's first
  // forecast goes to the worker too: on 4,096 nozzles it would hold the page for a second or more.
  let first = !!worker && !!doc.value && elementCount(doc.value) <= IN_PAGE_FIRST_MAX
  let busy = false
  if (worker && opts.focus)
    watch(opts.focus, id => {
      if (fromWorker && !busy) void refocus(shown, id)
    })
  let pending: ChipDocument | null = null
  let timer: ReturnType<typeof setTimeout> | undefined
  let rulesTimer: ReturnType<typeof setTimeout> | undefined
  // One run at a time; edits made meanwhile are folded into one run of the newest document when it ends.
  const run = async (d: ChipDocument) => {
    if (busy) {
      pending = d
      return
    }
    busy = true
    slowTimer = setTimeout(() => {
      slow.value = true
    }, SLOW_MS)
    const n = ++seq
    const lab = opts.lab?.value ?? null
    const here = first
    first = false
    let a: LiveAnswer
    if (!worker) {
      clearTimeout(rulesTimer)
      rulesTimer = setTimeout(() => {
        findings.value = runLiveRules(d, processId(), lab)
      }, 120)
      a = await (opts.runner ?? inThread)(d, n, lab)
    } else if (here) {
      rulesFor = n
      worker.warm(d, n, processId(), lab)
      a = await inThread(d, n, lab)
    } else {
      rulesFor = n
      sentFocus = focus()
      a = await worker.run(d, n, processId(), sentFocus, lab)
    }
    fromWorker = !!worker && !here
    busy = false
    clearTimeout(slowTimer)
    slow.value = false
    shown = n
    live.value = { forecast: a.forecast, summary: a.summary, error: a.error, at: performance.now() }
    if (pending) {
      const next = pending
      pending = null
      run(next)
    } else if (fromWorker && focus() !== sentFocus) void refocus(n, focus()) // the selection changed meanwhile
  }
  // With a worker the document is sent at once, so the forecast runs while the page redraws the chip; in the
  // page itself it waits for the redraw.
  watch(
    doc,
    d => {
      clearTimeout(timer)
      if (!d) return
      if (worker && !opts.delayMs && !first) run(d)
      else timer = setTimeout(() => run(d), opts.delayMs ?? 0)
    },
    { immediate: true, flush: worker ? 'sync' : 'pre' },
  )
  if (opts.processId)
    watch(opts.processId, () => {
      if (doc.value) run(doc.value)
    })
  if (opts.lab)
    watch(opts.lab, () => {
      if (doc.value) run(doc.value)
    })
  onScopeDispose(() => {
    clearTimeout(timer)
    clearTimeout(rulesTimer)
    clearTimeout(slowTimer)
    worker?.stop()
  })
  return { live, findings, slow }
}

export const viewerFindings = (fs: Finding[]): ViewerFinding[] =>
  fs.map(f => ({ id: f.id, severity: f.severity, x: f.location.x, y: f.location.y, message: f.message }))
