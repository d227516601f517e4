// Finding and cloning document elements by id. Ports, channels, components and marks share one id space.
import type { ChipDocument } from '../schemas/chip'
import type { ElementCollection } from './types'

export const SELECTABLE: ElementCollection[] = ['components', 'ports', 'channels', 'marks']

export type AnyElement = ChipDocument[ElementCollection][number]

export function findElement(
  doc: ChipDocument,
  id: string,
): { collection: ElementCollection; index: number; element: AnyElement } | null {
  for (const collection of SELECTABLE) {
    const index = (doc[collection] as AnyElement[]).findIndex(e => e.id === id)
    if (index >= 0) return { collection, index, element: doc[collection][index]! }
  }
  return null
}

/** Every id in use (elements, layers and operating points), for fresh ids. */
export function usedIds(doc: ChipDocument): Set<string> {
  const ids = new Set<string>()
  for (const c of SELECTABLE) for (const e of doc[c] as AnyElement[]) ids.add(e.id)
  for (const l of doc.layers) ids.add(l.id)
  for (const o of doc.operatingPoints) ids.add(o.id)
  return ids
}

/** `prefix-N` with the smallest N ≥ 1 not yet used. */
export function freshId(used: Set<string>, prefix: string): string {
  const base = prefix.replace(/-\d+$/, '')
  for (let n = 1; ; n++) {
    const id = `${base}-${n}`
    if (!used.has(id)) {
      used.add(id)
      return id
    }
  }
}

export const clone = <T>(v: T): T => structuredClone(v)

/** A new document with `collection` replaced (everything else shared, so unchanged parts stay the same objects). */
export function withCollection<C extends ElementCollection>(
  doc: ChipDocument,
  collection: C,
  items: ChipDocument[C],
): ChipDocument {
  return { ...doc, [collection]: items }
}
