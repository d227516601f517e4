// Text hygiene for every string of every payload: no NUL character and no lone UTF-16 surrogate. PostgreSQL
// cannot store either (text refuses U+0000, jsonb refuses "\u0000" and unpaired "\ud800"), so without this a
// stray byte from a copy-paste or a fuzzer became a 500. Refused here, once, the 400 names the field.
import { z } from 'zod'

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/

const hex = (code: number) => `U+${code.toString(16).toUpperCase().padStart(4, '0')}`

/** What is wrong with a text, or null when it can be stored as it is. Positions count from 1. */
export function textProblem(s: string): string | null {
  const nul = s.indexOf('\u0000')
  if (nul >= 0) return `must not contain a NUL character (U+0000, at character ${nul + 1}): remove it`
  const lone = LONE_SURROGATE.exec(s)
  if (lone) {
    return (
      `contains a broken character (a lone UTF-16 surrogate ${hex(lone[0].charCodeAt(0))} at character ${lone.index + 1}): ` +
      'the text was cut or mis-encoded; type it again'
    )
  }
  return null
}

/**
 * A string that PostgreSQL can store: refuses NUL and lone surrogates (and stops there, so the field's own
 * checks do not add noise). Chain the field's checks after it: `safeText().trim().min(1).max(120)`.
 * `label` starts the message (`Design name must not contain…`); without it the message starts "Text".
 */
export function safeText(params?: Parameters<typeof z.string>[0], label = 'Text') {
  return z.string(params).superRefine((s, ctx) => {
    const problem = textProblem(s)
    if (problem) ctx.addIssue({ code: 'custom', message: `${label} ${problem}`, continue: false })
  })
}
