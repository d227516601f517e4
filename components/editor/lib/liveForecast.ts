// The live forecast of the working document: forecast + summary right after every committed edit (a drag commits
// once, on release), computed in a Web Worker (lib/forecast.worker.ts) so the canvas keeps its frames; rule
// findings a moment later (they cost more on a large chip); and the canvas labels built from both.
import { onScopeDispose, shallowRef, toRaw, watch, type Ref } from 'vue'
import type { ChipDocument } from '#shared/schemas/chip'
import type { DocumentForecast, ForecastSummary } from '#shared/physics/document'
import { BUILT_IN_PROCESSES, checkDesignRules, findProcessIn, type FabricationProcess, type Finding, type LabProcessData } from '~~/geometry/rules'
import type { LabLiquidsData } from '#shared/physics/liquids'
import type { ViewerFinding, ViewerLabel } from '../../viewer/lib/markers'
import { runLiveForecast, type LiveAnswer, type LiveRequest } from './liveRun'

export interface LiveForecast { forecast: DocumentForecast | null; summary: ForecastSummary | null; error: string | null; at: number }

/** The design's own process for rule checks; the first built-in one only when the design names none we know. */
export const designProcess = (processId: string | null | undefined, lab: readonly LabProcessData[] = []): FabricationProcess =>
  (processId ? findProcessIn(processId, lab) : undefined) ?? BUILT_IN_PROCESSES[0]!

/** Runs one forecast: in a Web Worker in the browser, in the calling thread where there is none (tests, old browsers). */
export type ForecastRunner = (doc: ChipDocument, seq: number, lab?: LabLiquidsData | null) => Promise<LiveAnswer>

/** A runner in a Web Worker that can also be asked to warm up on a document (run it a few times, answer nothing). */
type WorkerRunner = ForecastRunner & { warm: (doc: ChipDocument) => void }

function workerRunner(): WorkerRunner | null {
  if (typeof Worker === 'undefined') return null
  let worker: Worker
  try { worker = new Worker(new URL('./forecast.worker.ts', import.meta.url), { type: 'module' }) } catch { return null }
  const waiting = new Map<number, { doc: ChipDocument; lab?: LabLiquidsData | null; done: (a: LiveAnswer) => void }>()
  worker.onmessage = (e: MessageEvent<LiveAnswer>) => { waiting.get(e.data.seq)?.done(e.data); waiting.delete(e.data.seq) }
  // A worker that fails to load or crashes: every waiting run is answered in the page itself, and so are later ones.
  let broken = false
  worker.onerror = () => { broken = true; for (const [seq, w] of waiting) w.done(runLiveForecast(w.doc, seq, w.lab)); waiting.clear() }
  const run: ForecastRunner = (doc, seq, lab) => new Promise((done) => {
    if (broken) { done(runLiveForecast(doc, seq, lab)); return }
    waiting.set(seq, { doc, lab, done })
    worker.postMessage({ seq, doc: toRaw(doc), lab: lab ? toRaw(lab) : null } satisfies LiveRequest)
  })
  return Object.assign(run, { warm: (doc: ChipDocument) => { if (!broken) worker.postMessage({ seq: 0, doc: toRaw(doc), warm: true } satisfies LiveRequest) } })
}
const inThread: ForecastRunner = async (doc, seq, lab) => runLiveForecast(doc, seq, lab)

/** A run taking longer than this shows "updating" (a shorter one would only flicker). */
const SLOW_MS = 150

/** `lab`: the lab's own liquids, pairs and processes (plain data, GET /api/v1/liquids?lab=); null → built-in only. */
export type LiveLab = LabLiquidsData & { processes: LabProcessData[] }

export function useLiveForecast(doc: Ref<ChipDocument | null>, opts: { delayMs?: number; processId?: Ref<string | null>; runner?: ForecastRunner; lab?: Ref<LiveLab | null> } = {}) {
  const live = shallowRef<LiveForecast>({ forecast: null, summary: null, error: null, at: 0 })
  const findings = shallowRef<Finding[]>([])
  /** True while a run has taken longer than SLOW_MS, so the panel can say the numbers are being updated. */
  const slow = shallowRef(false)
  let slowTimer: ReturnType<typeof setTimeout> | undefined
  const worker = opts.runner ? null : workerRunner()
  const runner = opts.runner ?? worker ?? inThread
  let seq = 0
  // The first forecast runs in the page, right after the chip is drawn, while the worker loads and warms up on
  // the same document; every later one runs in the worker.
  let first = !!worker
  let busy = false
  let pending: ChipDocument | null = null
  let timer: ReturnType<typeof setTimeout> | undefined
  let rulesTimer: ReturnType<typeof setTimeout> | undefined
  // One run at a time; edits made meanwhile are folded into one run of the newest document when it ends.
  const run = async (d: ChipDocument) => {
    if (busy) { pending = d; return }
    busy = true
    slowTimer = setTimeout(() => { slow.value = true }, SLOW_MS)
    clearTimeout(rulesTimer)
    rulesTimer = setTimeout(() => { findings.value = checkDesignRules(d, designProcess(opts.processId?.value, opts.lab?.value?.processes)) }, 120)
    const here = first
    if (here) worker!.warm(d)
    first = false
    const lab = opts.lab?.value ? { liquids: opts.lab.value.liquids, pairs: opts.lab.value.pairs } : null
    const a = await (here ? inThread : runner)(d, ++seq, lab)
    busy = false
    clearTimeout(slowTimer)
    slow.value = false
    live.value = { forecast: a.forecast, summary: a.summary, error: a.error, at: performance.now() }
    if (pending) { const next = pending; pending = null; run(next) }
  }
  // With a worker the document is sent at once, so the forecast runs while the page redraws the chip; in the
  // page itself it waits for the redraw.
  watch(doc, (d) => {
    clearTimeout(timer)
    if (!d) return
    if (worker && !opts.delayMs && !first) run(d)
    else timer = setTimeout(() => run(d), opts.delayMs ?? 0)
  }, { immediate: true, flush: worker ? 'sync' : 'pre' })
  if (opts.processId) watch(opts.processId, () => { if (doc.value) run(doc.value) })
  if (opts.lab) watch(opts.lab, () => { if (doc.value) run(doc.value) })
  onScopeDispose(() => { clearTimeout(timer); clearTimeout(rulesTimer); clearTimeout(slowTimer) })
  return { live, findings, slow }
}

const sig = (v: number, n = 2) => Number(v.toPrecision(n))

/**
 * Junction callouts (regime, Ø µm, caution when outside validity) and inlet callouts (pressure and flow; a fault
 * when the pressure exceeds the bond limit of the design's process).
 */
export function canvasLabels(doc: ChipDocument, summary: ForecastSummary | null, bondLimitMbar = Infinity): ViewerLabel[] {
  if (!summary) return []
  const comps = new Map(doc.components.map(c => [c.id, c]))
  const labels: ViewerLabel[] = []
  for (const j of summary.junctions) {
    const c = comps.get(j.id)
    if (!c) continue
    const lines = [`${j.valid ? '' : '⚠ '}${j.regime ?? 'no drops'}`, j.dropletDiameterUm != null ? `Ø ${sig(j.dropletDiameterUm)} µm` : 'Ø —']
    labels.push({ elementId: j.id, x: c.position.x, y: c.position.y, lines, tone: j.valid ? 'ok' : 'caution' })
  }
  const ports = new Map(doc.ports.map(p => [p.id, p]))
  for (const i of summary.inlets) {
    const p = ports.get(i.port)
    if (!p) continue
    const over = i.pressureMbar > bondLimitMbar
    const lines = [`${over ? '⚠ ' : ''}${sig(i.pressureMbar, 3)} mbar`, `${sig(i.flowUlPerMin, 3)} µL/min`]
    labels.push({ elementId: p.id, x: p.position.x, y: p.position.y, lines, tone: over ? 'fault' : 'ok' })
  }
  return labels
}

export const viewerFindings = (fs: Finding[]): ViewerFinding[] =>
  fs.map(f => ({ id: f.id, severity: f.severity, x: f.location.x, y: f.location.y, message: f.message }))
