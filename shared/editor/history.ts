// Undo history of whole documents (they are immutable and share unchanged parts, so a step costs little).
// A 'skip' result (a drag in progress) replaces the present without a step, remembering where it began; the
// next 'record' result files ONE step from that beginning, so a whole drag undoes at once.
import type { ChipDocument } from '../schemas/chip'
import type { HistoryPolicy } from './types'

export interface History {
  readonly past: readonly ChipDocument[]
  readonly present: ChipDocument
  readonly future: readonly ChipDocument[]
  /** The document before a run of 'skip' results, filed as the undo step when the run is recorded. */
  readonly pending: ChipDocument | null
  /** What each step did, in words ("move", "set mainWidth"), parallel to `past` and `future`. */
  readonly pastLabels: readonly string[]
  readonly futureLabels: readonly string[]
}

export const HISTORY_LIMIT = 200

export const startHistory = (doc: ChipDocument): History => ({
  past: [],
  present: doc,
  future: [],
  pending: null,
  pastLabels: [],
  futureLabels: [],
})

export function commit(h: History, doc: ChipDocument, policy: HistoryPolicy, label = 'edit'): History {
  if (policy === 'skip') return { ...h, present: doc, pending: h.pending ?? h.present }
  const before = h.pending ?? h.present
  if (before === doc) return { ...h, pending: null }
  return {
    past: [...h.past, before].slice(-HISTORY_LIMIT),
    present: doc,
    future: [],
    pending: null,
    pastLabels: [...h.pastLabels, label].slice(-HISTORY_LIMIT),
    futureLabels: [],
  }
}

/** What undo and redo would take back or do again, in words; null when there is nothing. */
export const undoLabel = (h: History): string | null =>
  h.pending ? 'drag' : (h.pastLabels[h.pastLabels.length - 1] ?? null)
export const redoLabel = (h: History): string | null => h.futureLabels[0] ?? null

/** Drops a run of 'skip' results (a cancelled drag): back to where it began, no step. */
export const cancelPending = (h: History): History => (h.pending ? { ...h, present: h.pending, pending: null } : h)

export const canUndo = (h: History): boolean => h.past.length > 0 || h.pending !== null
export const canRedo = (h: History): boolean => h.future.length > 0

export function undo(h: History): History {
  if (h.pending) return cancelPending(h)
  const prev = h.past[h.past.length - 1]
  if (!prev) return h
  const label = h.pastLabels[h.pastLabels.length - 1] ?? 'edit'
  return {
    past: h.past.slice(0, -1),
    present: prev,
    future: [h.present, ...h.future],
    pending: null,
    pastLabels: h.pastLabels.slice(0, -1),
    futureLabels: [label, ...h.futureLabels],
  }
}

export function redo(h: History): History {
  const [next, ...rest] = h.future
  if (!next) return h
  const [label = 'edit', ...labels] = h.futureLabels
  return {
    past: [...h.past, h.present],
    present: next,
    future: rest,
    pending: null,
    pastLabels: [...h.pastLabels, label],
    futureLabels: labels,
  }
}
