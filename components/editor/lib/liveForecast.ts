// The live forecast of the working document: forecast + summary right after every committed edit (a drag commits once, on release), rule
// findings a moment later (they cost more on a large chip), and the canvas labels built from both.
import { onScopeDispose, shallowRef, watch, type Ref } from 'vue'
import type { ChipDocument } from '#shared/schemas/chip'
import { forecastDocument, summarizeForecast, type DocumentForecast, type ForecastSummary } from '#shared/physics/document'
import { BUILT_IN_PROCESSES, checkDesignRules, findProcess, type FabricationProcess, type Finding } from '~~/geometry/rules'
import type { ViewerFinding, ViewerLabel } from '../../viewer/lib/markers'

export interface LiveForecast { forecast: DocumentForecast | null; summary: ForecastSummary | null; error: string | null; at: number }

/** The design's own process for rule checks; the first built-in one only when the design names none we know. */
export const designProcess = (processId: string | null | undefined): FabricationProcess =>
  (processId ? findProcess(processId) : undefined) ?? BUILT_IN_PROCESSES[0]!

export function useLiveForecast(doc: Ref<ChipDocument | null>, opts: { delayMs?: number; processId?: Ref<string | null> } = {}) {
  const live = shallowRef<LiveForecast>({ forecast: null, summary: null, error: null, at: 0 })
  const findings = shallowRef<Finding[]>([])
  let timer: ReturnType<typeof setTimeout> | undefined
  let rulesTimer: ReturnType<typeof setTimeout> | undefined
  const run = (d: ChipDocument) => {
    try {
      const forecast = forecastDocument(d)
      // Parts and channels not wired yet are left out by the forecast itself, with a warning naming each.
      const left = forecast.warnings.filter(w => w.code === 'component-unconnected' || w.code === 'channels-unconnected').map(w => (w as { element?: string }).element)
      const note = left.length ? `Not yet connected, so not forecast: ${left.join(', ')}` : null
      live.value = { forecast, summary: summarizeForecast(forecast), error: note, at: performance.now() }
    } catch (error) {
      live.value = { forecast: null, summary: null, error: error instanceof Error ? error.message : String(error), at: performance.now() }
    }
    clearTimeout(rulesTimer)
    rulesTimer = setTimeout(() => { findings.value = checkDesignRules(d, designProcess(opts.processId?.value)) }, 120)
  }
  watch(doc, (d) => {
    clearTimeout(timer)
    if (d) timer = setTimeout(() => run(d), opts.delayMs ?? 0)
  }, { immediate: true })
  if (opts.processId) watch(opts.processId, () => { if (doc.value) run(doc.value) })
  onScopeDispose(() => { clearTimeout(timer); clearTimeout(rulesTimer) })
  return { live, findings }
}

const sig = (v: number, n = 2) => Number(v.toPrecision(n))

/** Junction callouts (regime, Ø µm, caution when outside validity) and inlet callouts (pressure needed, mbar). */
export function canvasLabels(doc: ChipDocument, summary: ForecastSummary | null): ViewerLabel[] {
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
    if (p) labels.push({ elementId: p.id, x: p.position.x, y: p.position.y, lines: [`${sig(i.pressureMbar, 3)} mbar`], tone: 'ok' })
  }
  return labels
}

export const viewerFindings = (fs: Finding[]): ViewerFinding[] =>
  fs.map(f => ({ id: f.id, severity: f.severity, x: f.location.x, y: f.location.y, message: f.message }))
