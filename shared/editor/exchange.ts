// Export and import of a chip document as JSON. The file is the document itself (it carries `version`), so an
// older export upgrades through the schema's own steps on import.
import { parseChipDocument, type ChipDocument } from '../schemas/chip'
import { peopleError } from '../format/fieldLabels'

export const exportDocument = (doc: ChipDocument): string => `${JSON.stringify(doc, null, 2)}\n`

export function importDocument(text: string): { ok: true; doc: ChipDocument } | { ok: false; message: string } {
  let json: unknown
  try {
    json = JSON.parse(text)
  } catch (error) {
    return { ok: false, message: `This file is not JSON: ${error instanceof Error ? error.message : String(error)}` }
  }
  const parsed = parseChipDocument(json)
  if (!parsed.ok)
    return {
      ok: false,
      message: parsed.errors
        .slice(0, 3)
        .map(e => peopleError(e, json as Record<string, unknown>))
        .join('; '),
    }
  return { ok: true, doc: parsed.document }
}

/** A file name for an export: the design name in plain characters. */
export const exportFileName = (doc: ChipDocument): string =>
  `${doc.name.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-|-$/g, '') || 'chip'}.chip.json`
