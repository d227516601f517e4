// What the server stores beside each revision: junction kinds, counts, rule findings, the forecast summary and the
// library values used (a snapshot). Computed once when the revision is saved (revisions are immutable, so it never
// goes stale); the lab's library is passed in as plain data (`lab`) and merged with the built-in entries.
import { mergeLibrary } from '#shared/physics/liquids'
import { isJunctionKind } from '#shared/utils/junctionKinds'
import type { ChipDocument } from '#shared/schemas/chip'
import { checkDesignRules, processSnapshot, resolveProcess, type LabProcessData } from '../../geometry/rules'
import type { RevisionSummary } from '#shared/types/designs'
import { forecastSummary, liquidSnapshotOf } from './forecastSummary'
import type { LabLibraryData } from './libraries'

export function summarizeRevision(doc: ChipDocument, processId: string, lab?: LabLibraryData | null): RevisionSummary {
  const process = resolveProcess(processId, (lab?.processes ?? []) as LabProcessData[])
  const library = mergeLibrary(lab)
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
    junctionKinds: [...new Set(doc.components.map(c => c.kind).filter(isJunctionKind))].sort(),
    counts: {
      channels: doc.channels.length,
      components: doc.components.length,
      ports: doc.ports.length,
      layers: doc.layers.length,
    },
    ...forecastSummary(doc, library),
    findings,
    processId: process.id,
    library: { ...liquidSnapshotOf(doc, library), process: processSnapshot(process) },
  }
}
