import type { H3Event } from 'h3'
import { createError, getRouterParams, getQuery, readBody } from 'h3'
import type { z } from 'zod'

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

export async function validBody<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  const body = await readBody(event).catch(() => {
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: 'Body must be valid JSON' })
  })
  return parseOr400(schema, body ?? {}, 'Body')
}

export function validParams<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return parseOr400(schema, getRouterParams(event, { decode: true }), 'Address')
}

export function validQuery<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return parseOr400(schema, getQuery(event), 'Query')
}
