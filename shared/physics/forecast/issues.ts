// Zod issues → ForecastInputError issues with dotted paths ("junction.mainWidth", "network.channels.2.width").
import type { z } from 'zod'
import { ForecastInputError, type InputIssue } from '../errors'

function valueAt(input: unknown, path: PropertyKey[]): unknown {
  let value = input
  for (const key of path)
    value = typeof value === 'object' && value !== null ? (value as Record<PropertyKey, unknown>)[key] : undefined
  return value
}

export function toInputIssues(error: z.ZodError, prefix: (string | number)[] = [], input?: unknown): InputIssue[] {
  return error.issues.map(issue => {
    const path = [...prefix, ...issue.path].map(String).join('.')
    let message = issue.message
    if (issue.code === 'unrecognized_keys')
      message = `unknown field(s) ${issue.keys.map(k => `"${k}"`).join(', ')}; remove them or check their spelling`
    else if (
      (issue.code === 'invalid_type' || issue.code === 'invalid_union') &&
      valueAt(input, issue.path) === undefined
    )
      message = 'required field is missing'
    else if (issue.code === 'invalid_union')
      message = `${issue.message}: see docs/forecast-api.md for the accepted shapes`
    return { path, message }
  })
}

/** Parses with `schema` or throws a ForecastInputError naming every bad field. */
export function parseOrThrow<T extends z.ZodType>(
  schema: T,
  input: unknown,
  prefix: (string | number)[] = [],
): z.output<T> {
  const parsed = schema.safeParse(input)
  if (!parsed.success) throw new ForecastInputError(toInputIssues(parsed.error, prefix, input))
  return parsed.data
}
