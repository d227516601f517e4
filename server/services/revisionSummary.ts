// What the server stores beside each revision: junction kinds, counts, rule findings and the forecast summary.
// Computed once when the revision is saved (revisions are immutable, so it never goes stale).
import type { ChipDocument } from '#shared/schemas/chip'
import { BUILT_IN_PROCESSES, checkDesignRules, findProcess } from '../../geometry/rules'
import type { RevisionSummary } from '#shared/types/designs'
import { forecastSummary } from './forecastSummary'

const JUNCTION_KINDS = new Set(['t-junction', 'flow-focusing', 'step-nozzle', 'step-array', 'y-junction'])

export function summarizeRevision(doc: ChipDocument, processId: string): RevisionSummary {
  const process = findProcess(processId) ?? BUILT_IN_PROCESSES[0]!
  let findings = { errors: 0, warnings: 0, infos: 0 }
  try {
    for (const f of checkDesignRules(doc, process)) {
      if (f.severity === 'error') findings.errors++
      else if (f.severity === 'warning') findings.warnings++
      else findings.infos++
    }
  } catch (error) {
    findings = { errors: 1, warnings: 0, infos: 0 }
    console.error('[summary] design rules failed:', error)
  }
  return {
    junctionKinds: [...new Set(doc.components.map(c => c.kind).filter(k => JUNCTION_KINDS.has(k)))].sort(),
    counts: { channels: doc.channels.length, components: doc.components.length, ports: doc.ports.length, layers: doc.layers.length },
    ...forecastSummary(doc),
    findings,
    processId: process.id,
  }
}
