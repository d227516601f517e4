import type { H3Event } from 'h3'
import { createError, getRouterParams, getQuery } from 'h3'
import type { z } from 'zod'
import { assertBodyType, readLimitedBody } from './bodyLimit'

/** Parses with a shared zod schema; bad input becomes 400 with the zod issues (path + message). */
export function parseOr400<S extends z.ZodType>(schema: S, input: unknown, what = 'Request'): z.infer<S> {
  const result = schema.safeParse(input)
  if (result.success) return result.data
  const issues = result.error.issues.map(i => ({ path: i.path.join('.'), message: i.message }))
  throw createError({
    statusCode: 400,
    statusMessage: 'Bad Request',
    message: `${what} is invalid: ${issues.map(i => (i.path ? `${i.path}: ${i.message}` : i.message)).join('; ')}`,
    data: { issues },
  })
}

const utf8 = new TextDecoder('utf-8', { fatal: true })
const badBody = (message: string) => createError({ statusCode: 400, statusMessage: 'Bad Request', message })

/** JSON text to a value; `"__proto__"` keys are dropped, so no body can reach an object's prototype. */
function parseJson(text: string): unknown {
  return /"__proto__"\s*:/.test(text)
    ? JSON.parse(text, (key, value) => (key === '__proto__' ? undefined : value))
    : JSON.parse(text)
}

/**
 * The request body through the route's shared schema: only application/json (415), read once with a byte counter
 * against the route's limit (413, server/utils/bodyLimit.ts), UTF-8 and valid JSON (400); no body reads as `{}`.
 */
export async function validBody<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  assertBodyType(event)
  const raw = await readLimitedBody(event)
  let body: unknown = {}
  if (raw?.length) {
    let text: string
    try {
      text = utf8.decode(raw)
    } catch {
      throw badBody('Body must be UTF-8 text')
    }
    try {
      body = parseJson(text)
    } catch {
      throw badBody('Body must be valid JSON')
    }
  }
  return parseOr400(schema, body ?? {}, 'Body')
}

export function validParams<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return parseOr400(schema, getRouterParams(event, { decode: true }), 'Address')
}

export function validQuery<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return parseOr400(schema, getQuery(event), 'Query')
}
