// Shapes of the editor core: an edit is a named action that returns a new document and says whether it enters
// the undo history. Pure TypeScript: the store, the canvas and the tests all call the same functions.
import type { ChipDocument } from '../schemas/chip'

export type HistoryPolicy = 'record' | 'skip'

export interface ActionOutcome {
  doc: ChipDocument
  history: HistoryPolicy
}

/** `(doc, args) → { doc, history }`. An action may return a document that fails the schema: `runAction` refuses it. */
export type EditorAction<A> = (doc: ChipDocument, args: A) => ActionOutcome

/** The collections whose elements the canvas can select (they share one id space). */
export type ElementCollection = 'ports' | 'channels' | 'components' | 'marks'

export interface PointUm {
  x: number
  y: number
}

/** Why an edit was refused: the schema's own message, and where. */
export interface EditRefusal {
  message: string
  path: string
}

export type ActionResult = { ok: true; doc: ChipDocument; history: HistoryPolicy } | { ok: false; refusal: EditRefusal }
