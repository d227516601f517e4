// Raw JSON that goes to a worker unparsed by a schema (the forecast request) is cloned by postMessage, which
// recurses: a body nested thousands of levels deep overflowed the stack (a 500). Checked here without recursion.
import { createError } from 'h3'

/** Deeper than any request the API documents (a chip document nests about 8 levels). */
export const MAX_JSON_DEPTH = 64

export function assertJsonDepth(value: unknown, limit = MAX_JSON_DEPTH): void {
  const stack: Array<[unknown, number]> = [[value, 1]]
  while (stack.length) {
    const [v, depth] = stack.pop()!
    if (v === null || typeof v !== 'object') continue
    if (depth > limit) {
      throw createError({
        statusCode: 400,
        statusMessage: 'Bad Request',
        message: `The request nests deeper than ${limit} levels: no request the API takes is that deep`,
        data: { issues: [{ path: '', message: `nested deeper than ${limit} levels` }] },
      })
    }
    for (const child of Array.isArray(v) ? v : Object.values(v)) stack.push([child, depth + 1])
  }
}
