import type { z } from 'zod'
import { checkCrossReferences } from './cross-references'
import { chipDocumentShape } from './document-shape'

/** The chip document: fields plus cross-reference checks (ids, layers, terminals, operating points). */
export const chipDocument = chipDocumentShape.superRefine(checkCrossReferences)
export type ChipDocument = z.infer<typeof chipDocument>
/** What a caller may write (defaults not yet applied). */
export type ChipDocumentInput = z.input<typeof chipDocument>
