// After auth.ts (a request without a session gets its 401 before any byte of its body is read): every
// state-changing /api request has its body read here once, counted on the stream against the route's limit
// (413 the moment it passes; server/utils/bodyLimit.ts). Routes then take it from validBody (or h3's readBody);
// the routes whose rule says `toFile` stream theirs to a file instead.
import { defineEventHandler } from 'h3'
import { bodyRule, readLimitedBody, WRITE_METHODS } from '../utils/bodyLimit'

export default defineEventHandler(async event => {
  if (!event.path.startsWith('/api/') || !WRITE_METHODS.has(event.method)) return
  // A micrograph upload is streamed to a file by its route (saveLimitedBody), with the same limit.
  if (bodyRule(event.method, event.path.split('?')[0]!).toFile) return
  await readLimitedBody(event)
})
