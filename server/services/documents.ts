// Chip documents arriving over HTTP: validated by the shared chip schema, with a report naming each element.
import { createError } from 'h3'
import { parseChipDocument, type ChipDocument } from '#shared/schemas/chip'

export function validDocument(input: unknown): ChipDocument {
  const result = parseChipDocument(input)
  if (result.ok) return result.document
  const issues = result.errors.map(e => ({ path: e.path ? `document.${e.path}` : 'document', message: e.message }))
  throw createError({
    statusCode: 400,
    statusMessage: 'Bad Request',
    message: `The chip document is invalid: ${issues
      .slice(0, 5)
      .map(i => i.message)
      .join('; ')}${issues.length > 5 ? ` (and ${issues.length - 5} more)` : ''}`,
    data: { issues },
  })
}
