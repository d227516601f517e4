// Every edit result goes through the shared schema: an invalid document is refused with the schema's message,
// and the document the editor holds stays as it was. Only what the edit changed is parsed again
// (shared/schemas/chip/incremental.ts), so a check costs little on a big chip.
import { parseEditedDocument } from '../schemas/chip'
import type { ChipDocument } from '../schemas/chip'
import type { ActionResult, EditorAction } from './types'

export function runAction<A>(doc: ChipDocument, action: EditorAction<A>, args: A): ActionResult {
  let outcome
  try {
    outcome = action(doc, args)
  } catch (error) {
    return { ok: false, refusal: { path: '', message: error instanceof Error ? error.message : String(error) } }
  }
  const parsed = parseEditedDocument(outcome.doc)
  if (!parsed.ok) {
    const first = parsed.errors[0]!
    return { ok: false, refusal: { path: first.path, message: first.message } }
  }
  return { ok: true, doc: parsed.document, history: outcome.history }
}
