// Canvas markers for a revision: forecast labels beside junctions, pins for comment threads, rule findings.
import { confidenceOf, formatLengthUm } from '#shared/format/quantity'
import type { ChipDocument } from '~~/shared/schemas/chip'
import type { RevisionSummary, ThreadView } from '~~/shared/types/designs'

export function forecastLabels(doc: ChipDocument, summary: RevisionSummary) {
  const byId = new Map(summary.junctions.map(j => [j.id, j]))
  return doc.components.flatMap(c => {
    const j = byId.get(c.id)
    if (!j) return []
    const lines = [
      j.regime ?? '—',
      j.dropletDiameterUm != null ? `Ø ${formatLengthUm(j.dropletDiameterUm, confidenceOf(j.valid))}` : 'Ø —',
    ]
    return [
      {
        elementId: c.id,
        x: c.position.x,
        y: c.position.y,
        lines,
        tone: (j.valid ? 'ok' : 'caution') as 'ok' | 'caution',
      },
    ]
  })
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
