// Re-validating a document after an edit without parsing all of it again. Documents are immutable: an edit makes
// new objects for what it changes and keeps the others. An element object that came out of a successful parse is
// remembered (by identity) and taken as it is; changed and new elements are parsed by their own schema; the
// single-valued fields, the document totals and every cross-reference check run on the whole document each time. A document with any
// problem is handed to the full parse, so refusals read exactly as ever. The answer is the one
// `parseChipDocument` gives (a test compares them over many edits), at a fraction of the cost on a big chip.
import type { z } from 'zod'
import { checkCrossReferences } from './cross-references'
import type { ChipDocument } from './document'
import { chipDocumentShape, documentFields, ELEMENT_SCHEMAS, LAYERS_REQUIRED } from './document-shape'
import { parseChipDocument, type ParseChipDocumentResult } from './parse'
import { checkDocumentTotals } from './totals'

const parsed = new WeakSet<object>()
const LISTS = Object.keys(ELEMENT_SCHEMAS) as (keyof typeof ELEMENT_SCHEMAS)[]

/** Remember every element of a parsed document as valid as it stands. */
export function rememberParsed(doc: ChipDocument): void {
  for (const list of LISTS) for (const e of doc[list] as object[]) parsed.add(e)
}

/** Validates an edited document (current version), parsing again only elements not seen valid before. */
export function parseEditedDocument(input: ChipDocument): ParseChipDocumentResult {
  const issues: z.core.$ZodIssue[] = []
  const fields = documentFields.safeParse(input)
  if (!fields.success) issues.push(...fields.error.issues)
  const lists: Record<string, unknown[]> = {}
  for (const list of LISTS) {
    const items = (input as Record<string, unknown>)[list] ?? []
    if (!Array.isArray(items)) {
      issues.push({
        code: 'invalid_type',
        expected: 'array',
        path: [list],
        message: `Expected a list for "${list}"`,
        input: items,
      } as z.core.$ZodIssue)
      continue
    }
    if (list === 'layers' && items.length < 1)
      issues.push({
        code: 'too_small',
        origin: 'array',
        minimum: 1,
        inclusive: true,
        path: [list],
        message: LAYERS_REQUIRED,
        input: items,
      } as z.core.$ZodIssue)
    lists[list] = items.map((item, i) => {
      if (item && typeof item === 'object' && parsed.has(item)) return item
      const r = ELEMENT_SCHEMAS[list].safeParse(item)
      if (r.success) return r.data
      for (const issue of r.error.issues) issues.push({ ...issue, path: [list, i, ...issue.path] } as z.core.$ZodIssue)
      return item
    })
  }
  // A refusal is rare and must read exactly as ever: it comes from the full parse.
  if (issues.length) return parseChipDocument(input)
  // Keys in the schema's order, as a full parse gives them.
  const doc = {} as Record<string, unknown>
  for (const key of Object.keys(chipDocumentShape.shape)) {
    const value = key in lists ? lists[key] : (fields.data as Record<string, unknown>)[key]
    if (value !== undefined || key in (fields.data as object)) doc[key] = value
  }
  const ctx = {
    value: doc,
    issues: [] as z.core.$ZodIssue[],
    addIssue: (i: unknown) => issues.push(i as z.core.$ZodIssue),
  }
  checkDocumentTotals(doc as unknown as ChipDocument, ctx as unknown as z.core.$RefinementCtx)
  checkCrossReferences(doc as unknown as ChipDocument, ctx as unknown as z.core.$RefinementCtx)
  if (issues.length) return parseChipDocument(input)
  rememberParsed(doc as unknown as ChipDocument)
  return { ok: true, document: doc as unknown as ChipDocument, upgradedFrom: (doc as { version: number }).version }
}
