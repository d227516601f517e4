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

type Cheap = Omit<RevisionSummary, 'operatingPoint' | 'junctions' | 'inlets' | 'forecastError' | 'findings'>

/** What costs nothing to know: the junction kinds, counts, process and the library values the forecast will use. */
function cheapParts(doc: ChipDocument, processId: string, lab?: LabLibraryData | null) {
  const process = resolveProcess(processId, (lab?.processes ?? []) as LabProcessData[])
  const library = mergeLibrary(lab)
  const cheap: Cheap = {
    junctionKinds: [...new Set(doc.components.map(c => c.kind).filter(isJunctionKind))].sort(),
    counts: {
      channels: doc.channels.length,
      components: doc.components.length,
      ports: doc.ports.length,
      layers: doc.layers.length,
    },
    processId: process.id,
    library: { ...liquidSnapshotOf(doc, library), process: processSnapshot(process) },
  }
  return { process, library, cheap }
}

export function summarizeRevision(doc: ChipDocument, processId: string, lab?: LabLibraryData | null): RevisionSummary {
  const { process, library, cheap } = cheapParts(doc, processId, lab)
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
  return { ...cheap, ...forecastSummary(doc, library), findings }
}

/**
 * The summary a large chip's revision is saved with while the revision-summary job computes the rest
 * (server/services/summaryJob.ts): no junction numbers and no findings yet, `pending: true`.
 */
export function pendingSummary(doc: ChipDocument, processId: string, lab?: LabLibraryData | null): RevisionSummary {
  const { cheap } = cheapParts(doc, processId, lab)
  return {
    ...cheap,
    operatingPoint: doc.activeOperatingPoint ?? null,
    junctions: [],
    inlets: [],
    forecastError: null,
    findings: { errors: 0, warnings: 0, infos: 0 },
    pending: true,
  }
}

/**
 * What a pending summary becomes when its job gives up (retries spent): finished, never pending forever, with the
 * reason where the forecast would be and one rule error so nobody reads "no errors" into a chip nobody checked.
 */
export function givenUpSummary(stored: RevisionSummary, what: string, error: unknown): RevisionSummary {
  const { pending: _, ...rest } = stored
  const reason = error instanceof Error ? error.message : String(error)
  return {
    ...rest,
    forecastError: `No forecast or rule check for this ${what}: ${reason}`,
    findings: { errors: 1, warnings: 0, infos: 0 },
  }
}
