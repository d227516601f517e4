// Canvas markers for a revision: forecast labels beside junctions, pins for comment threads, rule findings.
import { confidenceOf, formatFlowUlMin, formatLengthUm, formatPressureMbar } from '#shared/format/quantity'
import type { ViewerLabel } from '~/components/viewer/lib/markers'
import type { ChipDocument } from '~~/shared/schemas/chip'
import type { RevisionSummary, ThreadView } from '~~/shared/types/designs'

/**
 * The canvas callouts of a forecast, in the editor (live) and on the revision page (stored): per junction its regime
 * and Ø (caution when outside validity), per inlet its pressure and flow (a fault above the process's bond limit).
 */
export function forecastLabels(
  doc: ChipDocument,
  summary: Pick<RevisionSummary, 'junctions' | 'inlets'> | null,
  bondLimitMbar = Infinity,
): ViewerLabel[] {
  if (!summary) return []
  const comps = new Map(doc.components.map(c => [c.id, c]))
  const ports = new Map(doc.ports.map(p => [p.id, p]))
  const labels: ViewerLabel[] = []
  for (const j of summary.junctions) {
    const c = comps.get(j.id)
    if (!c) continue
    const lines = [
      `${j.valid ? '' : '⚠ '}${j.regime ?? 'no drops'}`,
      j.dropletDiameterUm != null ? `Ø ${formatLengthUm(j.dropletDiameterUm, confidenceOf(j.valid))}` : 'Ø —',
    ]
    labels.push({ elementId: j.id, x: c.position.x, y: c.position.y, lines, tone: j.valid ? 'ok' : 'caution' })
  }
  for (const i of summary.inlets) {
    const p = ports.get(i.portId)
    if (!p) continue
    const over = i.pressureMbar > bondLimitMbar
    const lines = [`${over ? '⚠ ' : ''}${formatPressureMbar(i.pressureMbar)}`]
    // Summaries stored before flows were kept have none.
    if (i.flowUlPerMin != null) lines.push(formatFlowUlMin(i.flowUlPerMin))
    labels.push({ elementId: p.id, x: p.position.x, y: p.position.y, lines, tone: over ? 'fault' : 'ok' })
  }
  return labels
}

export function threadPins(threads: ThreadView[], activeId: string | null) {
  return threads.map((t, i) => ({
    id: t.id,
    x: t.anchor.x,
    y: t.anchor.y,
    index: i + 1,
    resolved: t.resolvedAt !== null,
    active: t.id === activeId,
  }))
}
