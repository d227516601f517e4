// Payloads of the designs and revisions API. One schema per payload, shared by forms and routes.
import { z } from 'zod'
import { JUNCTION_KINDS } from '../utils/junctionKinds'
import { REVISION_STATUSES } from '../utils/revisionStatus'
import { BUILT_IN_PROCESSES, LAB_PROCESS_ID } from '../../geometry/rules/processes'
import { labParams } from './labs'
import { safeText } from './text'

/** The starter chips a new design may begin from (server/services/starterDocument.ts). */
export const STARTER_KINDS = ['t-junction', 'flow-focusing', 'step-emulsifier'] as const
export const STARTER_LABELS: Record<(typeof STARTER_KINDS)[number], string> = {
  't-junction': 'T-junction (one cross-flow junction)',
  'flow-focusing': 'Flow-focusing cross (oil from both sides)',
  'step-emulsifier': 'Step emulsifier (a shallow nozzle into a deep reservoir)',
}

export const designParams = labParams.extend({ designId: z.uuid('Design id must be a UUID') })
export const revisionParams = labParams.extend({ revisionId: z.uuid('Revision id must be a UUID') })
export const maskExportParams = revisionParams.extend({ exportId: z.uuid('Export id must be a UUID') })
export const compareParams = labParams.extend({
  revisionId: z.uuid('Revision id must be a UUID'),
  otherId: z.uuid('Revision id must be a UUID'),
})

const name = safeText(undefined, 'Name')
  .trim()
  .min(1, 'Give the design a name')
  .max(120, 'A name is at most 120 characters')
const message = safeText(undefined, 'Message')
  .trim()
  .min(1, 'Say what changed in this revision')
  .max(500, 'A message is at most 500 characters')

export const designCreate = z.object({
  name,
  description: safeText(undefined, 'Description').max(2000, 'A description is at most 2000 characters').default(''),
  /** A built-in process, or one of the lab's own ("lab-…", checked against the lab's library on the server). */
  processId: safeText()
    .max(64)
    .refine(
      id => BUILT_IN_PROCESSES.some(p => p.id === id) || LAB_PROCESS_ID.test(id),
      'Choose one of the fabrication processes',
    )
    .optional(),
  /** A chip document (validated by the chip schema on the server); omitted → a starter document. */
  document: z.unknown().optional(),
  /** Which starter chip when no document is given (default the T-junction). */
  starter: z.enum(STARTER_KINDS, { error: `Starter must be one of ${STARTER_KINDS.join(', ')}` }).optional(),
  message: message.default('First revision'),
})
export type DesignCreate = z.input<typeof designCreate>

export const designUpdate = z.object({
  name: name.optional(),
  description: safeText(undefined, 'Description').max(2000, 'A description is at most 2000 characters').optional(),
  archived: z.boolean().optional(),
})

/** Designs per page of the list (default), the largest page size a caller may ask for, and the last page number. */
export const DESIGN_PAGE_SIZE = 50
export const MAX_DESIGN_PAGE_SIZE = 200
export const MAX_DESIGN_PAGE = 10_000
export const designListQuery = z.object({
  q: safeText(undefined, 'Search text').max(120, 'Search text is at most 120 characters').optional(),
  status: z.enum(REVISION_STATUSES).optional(),
  kind: z.enum(JUNCTION_KINDS).optional(),
  archived: z.enum(['true', 'false']).default('false'),
  sort: z.enum(['updated', 'name', 'created']).default('updated'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  /** 1-based page of `pageSize` rows in the chosen order; the answer's X-Total-Count header gives the total. */
  page: z.coerce
    .number('Page must be a whole number from 1')
    .int('Page must be a whole number from 1')
    .min(1, 'Page must be a whole number from 1')
    .max(MAX_DESIGN_PAGE, `Page is at most ${MAX_DESIGN_PAGE}: narrow the list with a search or filter`)
    .default(1),
  pageSize: z.coerce
    .number('Page size must be a whole number from 1 to 200')
    .int('Page size must be a whole number from 1 to 200')
    .min(1, 'Page size must be a whole number from 1 to 200')
    .max(MAX_DESIGN_PAGE_SIZE, `Page size is at most ${MAX_DESIGN_PAGE_SIZE} designs`)
    .default(DESIGN_PAGE_SIZE),
})
export type DesignListQueryParsed = z.infer<typeof designListQuery>

export const revisionCreate = z.object({
  /** The revision this one was edited from; must be the latest unless `branch` is set. */
  parentId: z.uuid('parentId must be the id of the revision you edited'),
  message,
  document: z.unknown().refine(v => v !== undefined, 'A revision needs a chip document'),
  branch: z.boolean().default(false),
})
export type RevisionCreate = z.input<typeof revisionCreate>

export const duplicateBody = z.object({
  targetLabId: z.uuid('Choose the lab to copy into'),
  name,
})

export const dxfQuery = z.object({
  mirror: z.enum(['true', 'false']).default('false'),
  /** Comma-separated layer ids or DXF layer names; all layers when omitted. */
  layers: safeText(undefined, 'Layer list').max(500, 'The layer list is at most 500 characters').optional(),
  /** Text as closed outlines (the default: every plotter prints them) or as DXF TEXT entities in a font. */
  text: z
    .enum(['outline', 'font'], {
      error: 'Text must be "outline" (letters drawn as shapes) or "font" (DXF text entities)',
    })
    .default('outline'),
})
