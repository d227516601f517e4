// Payloads of review: requests, comment threads pinned to the geometry, verdicts (the release: schemas/orders.ts).
import { z } from 'zod'
import { labParams } from './labs'
import { safeText } from './text'

export const threadParams = labParams.extend({ revisionId: z.uuid(), threadId: z.uuid('Thread id must be a UUID') })

const body = safeText(undefined, 'Comment')
  .trim()
  .min(1, 'Write a comment')
  .max(5000, 'A comment is at most 5000 characters')
const micrometres = z.number().finite('A pin position must be a finite number of µm').min(-1e6).max(1e6)

export const reviewRequestBody = z.object({
  reviewerIds: z.array(z.uuid()).min(1, 'Choose at least one reviewer').max(20),
})
export const threadCreate = z.object({
  anchor: z.object({
    x: micrometres,
    y: micrometres,
    elementId: safeText().max(100, 'An element id is at most 100 characters').optional(),
  }),
  body,
})
export const commentCreate = z.object({ body })
export const threadUpdate = z.object({ resolved: z.boolean() })
const note = safeText(undefined, 'Note').max(2000, 'A note is at most 2000 characters').default('')
export const verdictBody = z.object({ verdict: z.enum(['approve', 'request-changes']), note })
