// Payloads of review: requests, comment threads pinned to the geometry, verdicts and the release.
import { z } from 'zod'
import { FAB_STATUSES } from '../utils/fabStatus'
import { labParams } from './labs'

export const threadParams = labParams.extend({ revisionId: z.uuid(), threadId: z.uuid('Thread id must be a UUID') })

const body = z.string().trim().min(1, 'Write a comment').max(5000, 'A comment is at most 5000 characters')
const micrometres = z.number().finite('A pin position must be a finite number of µm').min(-1e6).max(1e6)

export const reviewRequestBody = z.object({ reviewerIds: z.array(z.uuid()).min(1, 'Choose at least one reviewer').max(20) })
export const threadCreate = z.object({
  anchor: z.object({ x: micrometres, y: micrometres, elementId: z.string().max(100).optional() }),
  body,
})
export const commentCreate = z.object({ body })
export const threadUpdate = z.object({ resolved: z.boolean() })
export const verdictBody = z.object({ verdict: z.enum(['approve', 'request-changes']), note: z.string().max(2000).default('') })
export const releaseBody = z.object({ note: z.string().max(2000).default('') })
export const fabStatusBody = z.object({ fabStatus: z.enum(FAB_STATUSES), note: z.string().max(2000).default('') })
