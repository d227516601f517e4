// Exact edits from the inspector and the operating-point panel: one field of one element, one inlet setting.
import type { ChipDocument, InletSetting, OperatingPoint } from '../schemas/chip'
import { findElement } from './elements'
import { reattach } from './attach'
import type { ActionOutcome } from './types'

/** Set a value at a dotted path ("position.x") in a copy of `target`; `undefined` removes the field. */
export function setPath<T extends object>(target: T, path: string, value: unknown): T {
  const [head, ...rest] = path.split('.')
  const copy = (Array.isArray(target) ? [...target] : { ...target }) as Record<string, unknown>
  if (rest.length === 0) {
    if (value === undefined) delete copy[head!]
    else copy[head!] = value
  } else {
    copy[head!] = setPath((copy[head!] as object) ?? {}, rest.join('.'), value)
  }
  return copy as T
}

/** One field of one element (component, port, channel or mark), e.g. `{ id: 'tj-1', path: 'mainWidth', value: 80 }`. */
export function setField(doc: ChipDocument, args: { id: string; path: string; value: unknown }): ActionOutcome {
  const found = findElement(doc, args.id)
  if (!found) throw new Error(`No element "${args.id}" in this design (it may have been deleted)`)
  if (args.path === 'id') throw new Error('Ids cannot be changed here; duplicate the element instead')
  const list = [...(doc[found.collection] as object[])]
  list[found.index] = setPath(found.element, args.path, args.value)
  const next = { ...doc, [found.collection]: list } as ChipDocument
  return { doc: reattach(next, new Set([args.id])), history: 'record' }
}

/** A document-level field: the design name or the active operating point. */
export function setDocumentField(
  doc: ChipDocument,
  args: { path: 'name' | 'activeOperatingPoint'; value: string },
): ActionOutcome {
  return { doc: { ...doc, [args.path]: args.value }, history: 'record' }
}

function withOperatingPoint(doc: ChipDocument, opId: string, f: (op: OperatingPoint) => OperatingPoint): ChipDocument {
  if (!doc.operatingPoints.some(o => o.id === opId)) throw new Error(`No operating point "${opId}" in this design`)
  return { ...doc, operatingPoints: doc.operatingPoints.map(o => (o.id === opId ? f(o) : o)) }
}

/** One field of an operating point: temperature, liquids, surfactant, tension. */
export function setOperatingPointField(
  doc: ChipDocument,
  args: { opId: string; path: string; value: unknown },
): ActionOutcome {
  return { doc: withOperatingPoint(doc, args.opId, o => setPath(o, args.path, args.value)), history: 'record' }
}

/** How one inlet is driven at an operating point (replaces any earlier setting of that port). */
export function setInlet(doc: ChipDocument, args: { opId: string; setting: InletSetting }): ActionOutcome {
  return {
    doc: withOperatingPoint(doc, args.opId, o => {
      const inlets = o.inlets.some(i => i.portId === args.setting.portId)
        ? o.inlets.map(i => (i.portId === args.setting.portId ? { ...args.setting } : i))
        : [...o.inlets, { ...args.setting }]
      return { ...o, inlets }
    }),
    history: 'record',
  }
}
