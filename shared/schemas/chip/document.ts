import type { z } from 'zod'
import { checkCrossReferences } from './cross-references'
import { chipDocumentShape } from './document-shape'
import { checkDocumentTotals } from './totals'

/** The chip document: fields, document totals and cross-reference checks (ids, layers, terminals, operating points). */
export const chipDocument = chipDocumentShape.superRefine((doc, ctx) => {
  checkDocumentTotals(doc, ctx)
  checkCrossReferences(doc, ctx)
})
export type ChipDocument = z.infer<typeof chipDocument>
/** What a caller may write (defaults not yet applied). */
export type ChipDocumentInput = z.input<typeof chipDocument>
