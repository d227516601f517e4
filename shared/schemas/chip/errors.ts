import type { z } from 'zod'

/** One problem in a chip document, with where it is and what to do about it. */
export interface ChipDocumentError {
  /** Dotted path into the document, e.g. `channels.2.width`. */
  path: string
  /** The element the problem sits on, when it sits on one. */
  element?: { collection: string; id: string }
  message: string
}

const COLLECTION_NOUN: Record<string, string> = {
  layers: 'layer',
  ports: 'port',
  channels: 'channel',
  components: 'component',
  marks: 'mark',
  operatingPoints: 'operating point',
}

function at(input: unknown, path: readonly PropertyKey[]): unknown {
  let v: unknown = input
  for (const key of path) {
    if (v === null || typeof v !== 'object') return undefined
    v = (v as Record<PropertyKey, unknown>)[key]
  }
  return v
}

function elementOf(input: unknown, path: readonly PropertyKey[]): ChipDocumentError['element'] | undefined {
  const [collection, index] = path
  if (typeof collection !== 'string' || typeof index !== 'number' || !(collection in COLLECTION_NOUN)) return undefined
  const el = at(input, [collection, index]) as { id?: unknown; kind?: unknown } | undefined
  const id = typeof el?.id === 'string' && el.id !== '' ? el.id : `#${index + 1}`
  return { collection, id }
}

function noun(input: unknown, path: readonly PropertyKey[], collection: string): string {
  if (collection !== 'components') return COLLECTION_NOUN[collection] ?? collection
  const kind = (at(input, path.slice(0, 2)) as { kind?: unknown } | undefined)?.kind
  return typeof kind === 'string' ? kind : 'component'
}

function shown(v: unknown): string {
  if (typeof v === 'number') return Number.isNaN(v) ? 'NaN' : String(v)
  if (typeof v === 'string') return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v)
  if (v === undefined) return 'nothing'
  if (v === null) return 'null'
  return Array.isArray(v) ? `a list of ${v.length}` : typeof v
}

/**
 * Turns zod issues into messages that name the element and the fix, e.g.
 * `Channel width must be > 0 µm (got -3) on channel "feed-2"`. Cross-reference issues already name their
 * element (params.final) and are passed through.
 */
export function formatIssues(issues: readonly z.core.$ZodIssue[], input: unknown): ChipDocumentError[] {
  return issues.map(issue => {
    const path = issue.path
    const element = elementOf(input, path)
    const dotted = path.map(String).join('.')
    const final = issue.code === 'custom' && (issue.params as { final?: boolean } | undefined)?.final === true
    if (final) return { path: dotted, element, message: issue.message }
    let message = issue.message
    const value = at(input, path)
    const scalar = value === undefined || value === null || typeof value !== 'object'
    if (scalar && issue.code !== 'unrecognized_keys') message += ` (got ${shown(value)})`
    if (element) {
      const inner = path.slice(2).map(String).join('.')
      message += ` on ${noun(input, path, element.collection)} "${element.id}"`
      if (inner && !/^[a-zA-Z]+$/.test(inner)) message += ` at ${inner}`
    } else if (dotted) {
      message += ` at ${dotted}`
    }
    return { path: dotted, element, message }
  })
}
