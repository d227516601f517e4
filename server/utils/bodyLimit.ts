import type { H3Event } from 'h3'
import { createError, getRequestHeader } from 'h3'

/** Documented request-size limit for JSON bodies that carry chip documents: 8 MiB. */
export const MAX_DOCUMENT_BYTES = 8 * 1024 * 1024

export function assertBodySize(event: H3Event, limit = MAX_DOCUMENT_BYTES) {
  const length = Number(getRequestHeader(event, 'content-length') ?? 0)
  if (length > limit) {
    throw createError({ statusCode: 413, statusMessage: 'Payload Too Large', message: `The request is ${(length / 1048576).toFixed(1)} MiB; the limit is ${limit / 1048576} MiB` })
  }
}
