// The compare overlay: which geometry is only in the other revision (removed), only in this one (added), or in
// both but drawn differently (changed: other pieces, other layers, or a layer whose depth changed).
import type { ChipDocument } from '#shared/schemas/chip'
import type { Polygon } from '~~/geometry/types'
import { diffDocuments, type DocumentDiff } from './diffDocuments'
import { flatRing, sceneFor, type ChipScene } from './scene'

export interface CompareOverlay {
  diff: DocumentDiff
  /** Rings (flat, µm) of this revision's added elements. */
  added: Float64Array[]
  /** Rings of the other revision's removed elements. */
  removed: Float64Array[]
  /** Rings of changed elements as they are now, and as they were. */
  changed: Float64Array[]
  changedBefore: Float64Array[]
  ids: { added: string[]; removed: string[]; changed: string[] }
}

type Placed = Array<{ layerId: string; pieces: Polygon[] }>

const byElement = (scene: ChipScene): Map<string, Placed> => {
  const m = new Map<string, Placed>()
  for (const e of scene.elements) {
    const list = m.get(e.elementId) ?? []
    list.push({ layerId: e.layerId, pieces: e.pieces })
    m.set(e.elementId, list)
  }
  return m
}

const rings = (placed: Placed | undefined): Float64Array[] =>
  (placed ?? []).flatMap(p => p.pieces.flatMap(poly => poly.map((r, i) => flatRing(r, i === 0))))

function sameGeometry(a: Placed, b: Placed, depthA: Map<string, number>, depthB: Map<string, number>): boolean {
  if (a.length !== b.length) return false
  return a.every((pa, i) => {
    const pb = b[i]!
    if (pa.layerId !== pb.layerId || depthA.get(pa.layerId) !== depthB.get(pb.layerId)) return false
    if (pa.pieces.length !== pb.pieces.length) return false
    return pa.pieces.every((poly, j) => {
      const q = pb.pieces[j]!
      return (
        poly.length === q.length &&
        poly.every((ring, k) => {
          const r = q[k]!
          return (
            ring.length === r.length &&
            ring.every((pt, n) => Math.abs(pt[0] - r[n]![0]) < 1e-6 && Math.abs(pt[1] - r[n]![1]) < 1e-6)
          )
        })
      )
    })
  })
}

const memo = new WeakMap<ChipDocument, WeakMap<ChipDocument, CompareOverlay>>()

/** The overlay of `now` against `before`, memoised per pair of document objects. */
export function compareOverlay(now: ChipDocument, before: ChipDocument): CompareOverlay {
  let inner = memo.get(now)
  if (!inner) {
    inner = new WeakMap()
    memo.set(now, inner)
  }
  let o = inner.get(before)
  if (!o) {
    o = buildCompareOverlay(now, before)
    inner.set(before, o)
  }
  return o
}

export function buildCompareOverlay(now: ChipDocument, before: ChipDocument): CompareOverlay {
  const diff = diffDocuments(before, now)
  const a = byElement(sceneFor(now))
  const b = byElement(sceneFor(before))
  const depthNow = new Map(now.layers.map(l => [l.id, l.depth]))
  const depthBefore = new Map(before.layers.map(l => [l.id, l.depth]))
  const changedIds = [...a.keys()].filter(
    id => b.has(id) && !sameGeometry(a.get(id)!, b.get(id)!, depthNow, depthBefore),
  )
  const addedIds = [...a.keys()].filter(id => !b.has(id))
  const removedIds = [...b.keys()].filter(id => !a.has(id))
  return {
    diff,
    added: addedIds.flatMap(id => rings(a.get(id))),
    removed: removedIds.flatMap(id => rings(b.get(id))),
    changed: changedIds.flatMap(id => rings(a.get(id))),
    changedBefore: changedIds.flatMap(id => rings(b.get(id))),
    ids: { added: addedIds, removed: removedIds, changed: changedIds },
  }
}
