import { chipDocument } from './document'
import type { ChipDocument } from './document'
import { CHIP_DOCUMENT_VERSION } from './document-shape'
import type { ChipDocumentError } from './errors'
import { formatIssues } from './errors'
import { upgradeChipDocument } from './upgrades'

export type ParseChipDocumentResult =
  { ok: true; document: ChipDocument; upgradedFrom: number } | { ok: false; errors: ChipDocumentError[] }

/** Upgrades any older document to the current version, then validates it. Never throws on bad input. */
export function parseChipDocument(input: unknown): ParseChipDocumentResult {
  const upgraded = upgradeChipDocument(input, CHIP_DOCUMENT_VERSION)
  if (!upgraded.ok) return { ok: false, errors: [{ path: 'version', message: upgraded.message }] }
  const result = chipDocument.safeParse(upgraded.document)
  if (!result.success) return { ok: false, errors: formatIssues(result.error.issues, upgraded.document) }
  return { ok: true, document: result.data, upgradedFrom: upgraded.from }
}

/** Thrown by `requireChipDocument`; `errors` lists every problem. */
export class ChipDocumentInvalid extends Error {
  constructor(readonly errors: ChipDocumentError[]) {
    super(errors.map(e => e.message).join('\n'))
    this.name = 'ChipDocumentInvalid'
  }
}

/** Like `parseChipDocument`, but throws `ChipDocumentInvalid` (for callers that map it to a 400). */
export function requireChipDocument(input: unknown): ChipDocument {
  const r = parseChipDocument(input)
  if (!r.ok) throw new ChipDocumentInvalid(r.errors)
  return r.document
}
