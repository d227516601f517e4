// Deleting and copying elements. Copies get fresh ids; a copied channel keeps its attachments to elements copied
// with it (renamed) and lets go of the others, so a copy never reaches back into the original.
import type { Channel, ChipDocument } from '../schemas/chip'
import { findElement, freshId, usedIds, type AnyElement } from './elements'
import type { ActionOutcome, ElementCollection, PointUm } from './types'

/** Remove the selected elements; channel ends attached to them come loose; inlet settings of removed ports go. */
export function remove(doc: ChipDocument, args: { ids: string[] }): ActionOutcome {
  const ids = new Set(args.ids)
  const loosen = (ch: Channel): Channel => {
    const { start, end, ...rest } = ch
    return {
      ...rest,
      ...(start && !ids.has(start.element) ? { start } : {}),
      ...(end && !ids.has(end.element) ? { end } : {}),
    }
  }
  return {
    doc: {
      ...doc,
      components: doc.components.filter(c => !ids.has(c.id)),
      ports: doc.ports.filter(p => !ids.has(p.id)),
      marks: doc.marks.filter(m => !ids.has(m.id)),
      channels: doc.channels.filter(c => !ids.has(c.id)).map(loosen),
      operatingPoints: doc.operatingPoints.map(o => ({ ...o, inlets: o.inlets.filter(i => !ids.has(i.portId)) })),
    },
    history: 'record',
  }
}

/** What copy puts on the clipboard: the elements themselves, by collection (plain JSON). */
export interface Clip {
  items: Array<{ collection: ElementCollection; element: AnyElement }>
}

export function copy(doc: ChipDocument, ids: string[]): Clip {
  return {
    items: ids.flatMap(id => {
      const f = findElement(doc, id)
      return f ? [{ collection: f.collection, element: structuredClone(f.element) }] : []
    }),
  }
}

const shift = (p: PointUm, d: PointUm): PointUm => ({ x: p.x + d.x, y: p.y + d.y })

/** Insert a clip shifted by `offset` µm; returns the new ids in `inserted` (the store selects them). */
export function paste(doc: ChipDocument, args: { clip: Clip; offset: PointUm; inserted?: string[] }): ActionOutcome {
  const used = usedIds(doc)
  const rename = new Map<string, string>()
  for (const { element } of args.clip.items) rename.set(element.id, freshId(used, element.id))
  const next = {
    ...doc,
    components: [...doc.components],
    ports: [...doc.ports],
    channels: [...doc.channels],
    marks: [...doc.marks],
  }
  for (const { collection, element } of args.clip.items) {
    const e = structuredClone(element) as AnyElement & Record<string, unknown>
    e.id = rename.get(element.id)!
    if ('position' in e) e.position = shift(e.position as PointUm, args.offset)
    if (collection === 'channels') {
      const ch = e as unknown as Channel
      ch.points = ch.points.map(p => shift(p, args.offset))
      for (const key of ['start', 'end'] as const) {
        const ref = ch[key]
        if (ref) {
          const to = rename.get(ref.element)
          if (to) ch[key] = { ...ref, element: to }
          else delete ch[key]
        }
      }
    }
    ;(next[collection] as AnyElement[]).push(e)
  }
  args.inserted?.push(...rename.values())
  return { doc: next, history: 'record' }
}

/** Copy and paste in one step, a little up and to the right. */
export function duplicate(
  doc: ChipDocument,
  args: { ids: string[]; offset: PointUm; inserted?: string[] },
): ActionOutcome {
  return paste(doc, { clip: copy(doc, args.ids), offset: args.offset, inserted: args.inserted })
}
