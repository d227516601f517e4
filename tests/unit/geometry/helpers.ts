import type { ChipDocument, ChipDocumentInput } from '#shared/schemas/chip'
import { parseChipDocument, toWorld } from '#shared/schemas/chip'
import { loadDocumentFixture } from '../schemas/load-fixture'

export function parsed(input: unknown): ChipDocument {
  const r = parseChipDocument(input)
  if (!r.ok) throw new Error(r.errors.map(e => e.message).join('\n'))
  return r.document
}

export const fixture = (name: string): ChipDocument => parsed(loadDocumentFixture(name))

/** A minimal one-layer document around the given channels (outline 0..10 000 µm). */
export function channelsDoc(channels: NonNullable<ChipDocumentInput['channels']>, depth = 50): ChipDocument {
  return parsed({
    version: 1,
    name: 'test',
    units: 'um',
    layers: [{ id: 'L', name: 'L', depth }],
    channels,
    outline: { kind: 'rectangle', corner: { x: 0, y: 0 }, width: 10000, height: 10000 },
  })
}

/** The same document rotated by `deg` about `pivot` and moved by `shift` (every position and point). */
export function moved(
  doc: ChipDocument,
  deg: number,
  shift: { x: number; y: number },
  pivot = { x: 5000, y: 5000 },
): ChipDocument {
  const tp = (p: { x: number; y: number }) => {
    const w = toWorld({ x: p.x - pivot.x, y: p.y - pivot.y }, pivot, deg)
    return { x: w.x + shift.x, y: w.y + shift.y }
  }
  const o = doc.outline
  const outline = !o
    ? undefined
    : o.kind === 'polygon'
      ? { kind: 'polygon' as const, points: o.points.map(tp) }
      : {
          kind: 'polygon' as const,
          points: [
            [0, 0],
            [o.width, 0],
            [o.width, o.height],
            [0, o.height],
          ].map(([x, y]) => tp({ x: o.corner.x + x!, y: o.corner.y + y! })),
        }
  return parsed({
    ...doc,
    outline,
    ports: doc.ports.map(p => ({ ...p, position: tp(p.position) })),
    channels: doc.channels.map(c => ({ ...c, points: c.points.map(tp) })),
    components: doc.components.map(c => ({ ...c, position: tp(c.position), rotation: c.rotation + deg })),
    marks: doc.marks.map(m => ({ ...m, position: tp(m.position) })),
  })
}
