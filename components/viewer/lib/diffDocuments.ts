// What changed between two chip documents, element by element. Pure and framework-free (types only) so the
// server can import it for the compare table as well as the viewer's overlay.
import type { ChipDocument } from '#shared/schemas/chip'

export type DiffCollection =
  'document' | 'layers' | 'ports' | 'channels' | 'components' | 'marks' | 'outline' | 'operatingPoints'
export type DiffStatus = 'added' | 'removed' | 'changed'

/** One changed field: a dotted path into the element (`position.x`, `mainWidth`); arrays count as one field. */
export interface FieldChange {
  path: string
  before: unknown
  after: unknown
}

export interface DiffEntry {
  collection: DiffCollection
  /** Element id; `outline` for the chip outline, `document` for document-level fields. */
  id: string
  status: DiffStatus
  /** The element's kind where it has one (`t-junction`, `cross`, `inlet` …). */
  kind?: string
  /** Changed fields; empty for added and removed entries. */
  fields: FieldChange[]
}

export interface DocumentDiff {
  entries: DiffEntry[]
  /** Ids by status for the geometry collections (ports, channels, components, marks, outline). */
  added: string[]
  removed: string[]
  changed: string[]
}

/** Numbers closer than this are equal (µm, mbar …): float noise from a round trip is not a change. */
const EPS = 1e-9

const GEOMETRY: ReadonlySet<DiffCollection> = new Set(['ports', 'channels', 'components', 'marks', 'outline'])

type Keyed = { id: string; kind?: string }

/**
 * Compares `before` (e.g. the older revision) with `after`: an element only in `after` is added, only in
 * `before` removed, in both with any differing field changed (with the fields). Entries keep the document
 * order of `after`, then removed ones in the order of `before`.
 */
export function diffDocuments(before: ChipDocument, after: ChipDocument): DocumentDiff {
  const entries: DiffEntry[] = []
  const docFields = (['name', 'activeOperatingPoint'] as const)
    .filter(k => !same(before[k], after[k]))
    .map(k => ({ path: k, before: before[k], after: after[k] }))
  if (docFields.length) entries.push({ collection: 'document', id: 'document', status: 'changed', fields: docFields })

  const lists: Array<[DiffCollection, Keyed[], Keyed[]]> = [
    ['layers', before.layers, after.layers],
    ['ports', before.ports, after.ports],
    ['channels', before.channels, after.channels],
    ['components', before.components, after.components],
    ['marks', before.marks, after.marks],
    [
      'outline',
      before.outline ? [{ id: 'outline', ...before.outline }] : [],
      after.outline ? [{ id: 'outline', ...after.outline }] : [],
    ],
    ['operatingPoints', before.operatingPoints, after.operatingPoints],
  ]
  for (const [collection, a, b] of lists) entries.push(...diffList(collection, a, b))

  const ids = (s: DiffStatus) => entries.filter(e => e.status === s && GEOMETRY.has(e.collection)).map(e => e.id)
  return { entries, added: ids('added'), removed: ids('removed'), changed: ids('changed') }
}

function diffList(collection: DiffCollection, before: Keyed[], after: Keyed[]): DiffEntry[] {
  const old = new Map(before.map(e => [e.id, e]))
  const now = new Set(after.map(e => e.id))
  const out: DiffEntry[] = []
  for (const e of after) {
    const prev = old.get(e.id)
    const kind = kindOf(e)
    if (!prev) {
      out.push({ collection, id: e.id, status: 'added', kind, fields: [] })
      continue
    }
    const fields: FieldChange[] = []
    fieldChanges(prev, e, '', fields)
    if (fields.length) out.push({ collection, id: e.id, status: 'changed', kind, fields })
  }
  for (const e of before)
    if (!now.has(e.id)) out.push({ collection, id: e.id, status: 'removed', kind: kindOf(e), fields: [] })
  return out
}

const kindOf = (e: Keyed): string | undefined => (typeof e.kind === 'string' ? e.kind : undefined)

const isPlainObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v)

/** Recurses into plain objects; arrays and primitives are leaves compared as a whole. */
function fieldChanges(a: unknown, b: unknown, prefix: string, out: FieldChange[]): void {
  if (isPlainObject(a) && isPlainObject(b)) {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)])
    for (const k of keys) {
      if (k === 'id') continue
      fieldChanges(a[k], b[k], prefix ? `${prefix}.${k}` : k, out)
    }
    return
  }
  if (!same(a, b)) out.push({ path: prefix, before: a, after: b })
}

/** Deep equality with a small tolerance on numbers; `undefined` fields equal missing ones. */
export function same(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number')
    return a === b || Math.abs(a - b) <= EPS * Math.max(1, Math.abs(a), Math.abs(b))
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((v, i) => same(v, b[i]))
  if (isPlainObject(a) && isPlainObject(b)) {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)])
    for (const k of keys) if (!same(a[k], b[k])) return false
    return true
  }
  return a === b
}
