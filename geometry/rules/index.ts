import type { ChipDocument } from '#shared/schemas/chip'
import type { ChipOutlines } from '../outlines'
import { buildOutlines } from '../outlines'
import { crossingFindings } from './crossings'
import { elementFindings } from './element-checks'
import { spacingFindings } from './layer-spacing'
import type { SpacingMethod } from './layer-spacing'
import { liquidFindings } from './liquids'
import { placementFindings } from './placement'
import type { FabricationProcess, Finding } from './types'
import { findingId } from './types'

export interface RuleOptions {
  /** Reuse outlines already built (the editor and the DXF route build them anyway). */
  outlines?: ChipOutlines
  /** Use the O(n²) all-pairs spacing search (benchmark only). */
  naive?: boolean
  /** Width and gap by sizing (default) or by edge pairs alone (the reference in tests). */
  spacing?: SpacingMethod
}

const ORDER = { error: 0, warning: 1, info: 2 } as const

/** Every design-rule finding for a document under one fabrication process, errors first, stable order. */
export function checkDesignRules(doc: ChipDocument, process: FabricationProcess, options: RuleOptions = {}): Finding[] {
  const o = options.outlines ?? buildOutlines(doc)
  const geometry: Finding[] = o.problems.map(pr => ({
    id: findingId(pr.rule, [pr.elementId]),
    rule: pr.rule,
    severity: 'error',
    message: pr.message,
    elements: [pr.elementId],
    location: pr.location,
  }))
  const all = [
    ...geometry,
    ...spacingFindings(o, process, options.naive ?? false, options.spacing ?? 'sizing'),
    ...elementFindings(doc, process),
    ...crossingFindings(doc),
    ...placementFindings(doc, o, process),
    ...liquidFindings(doc, process),
  ]
  return all.sort((a, b) => ORDER[a.severity] - ORDER[b.severity] || a.id.localeCompare(b.id))
}

export {
  BUILT_IN_PROCESSES,
  findProcess,
  findProcessIn,
  labProcess,
  processFromSnapshot,
  processSnapshot,
  processValuesSource,
  processesWith,
  resolveProcess,
  revisionProcess,
  snapshotAsLabData,
  type LabProcessData,
  type ProcessSnapshot,
} from './processes'
export type { FabricationProcess, Finding, Severity } from './types'
export type { SpacingMethod } from './layer-spacing'
export { classifyLiquid } from './liquids'
