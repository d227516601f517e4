// Drawing at scale: the scene after an edit is rebuilt from the elements the edit touched, and equals a scene built
// from scratch; chunks outside the view are culled and tiny ones simplified (components/viewer/lib/draw.ts).
import { describe, expect, it } from 'vitest'
import { generateParallelChip } from '../../../geometry/arrays'
import { move } from '../../../shared/editor/transform'
import { chunkDetail, BLOCK_PX, DETAIL_PX } from '../../../components/viewer/lib/draw'
import { buildScene, sceneFor, type ChipScene } from '../../../components/viewer/lib/scene'
import { visibleBounds } from '../../../components/viewer/lib/viewport'

const flat = (s: ChipScene) => ({
  layers: s.layers.map(l => ({
    id: l.layerId,
    rings: l.rings.map(r => Array.from(r)),
    chunked: l.chunks.flatMap(c => c.rings.map(r => Array.from(r))),
  })),
  marks: s.marks.map(r => Array.from(r)),
  elements: s.elements.map(e => [e.elementId, e.layerId, e.pieces]),
  index: s.index.pieces.map(p => [p.elementId, p.layerId, p.area]),
  bounds: s.bounds,
  problems: s.problems,
})

describe('incremental scene', () => {
  const doc = generateParallelChip({ nozzles: 512 })
  const before = sceneFor(doc)
  const nozzle = doc.components[200]!.id
  const after = move(doc, { ids: [nozzle], dx: 40, dy: -20 }).doc

  it('equals the scene built from scratch after moving one nozzle', () => {
    const fresh = buildScene(structuredClone(after)) // new objects: nothing is reused
    expect(flat(sceneFor(after))).toEqual(flat(fresh))
    expect(flat(sceneFor(after))).not.toEqual(flat(before))
  })

  it('reuses the rings and chunks of every element the edit did not touch', () => {
    const s = sceneFor(after)
    for (const [i, l] of s.layers.entries()) {
      const old = new Set(before.layers[i]!.chunks)
      const reused = l.chunks.filter(c => old.has(c)).length
      // the moved nozzle and the channels attached to it change at most a few chunks per layer
      expect(l.chunks.length - reused).toBeLessThanOrEqual(3)
      expect(reused).toBeGreaterThan(0)
      const oldRings = new Set(before.layers[i]!.rings)
      expect(l.rings.filter(r => !oldRings.has(r)).length).toBeLessThanOrEqual(12)
    }
  })

  it('keeps chunks to a few hundred rings and their boxes around their rings', () => {
    for (const l of before.layers)
      for (const c of l.chunks) {
        expect(c.rings.length).toBeLessThanOrEqual(256 + 8)
        for (const r of c.rings)
          for (let k = 0; k < r.length; k += 2) {
            expect(r[k]!).toBeGreaterThanOrEqual(c.box.minX)
            expect(r[k]!).toBeLessThanOrEqual(c.box.maxX)
            expect(r[k + 1]!).toBeGreaterThanOrEqual(c.box.minY)
            expect(r[k + 1]!).toBeLessThanOrEqual(c.box.maxY)
          }
      }
  })
})

describe('level of detail and culling', () => {
  const chunk = { rings: [], box: { minX: 0, minY: 0, maxX: 1000, maxY: 200 }, maxSide: 150 }
  it('skips a chunk outside the view', () => {
    const seen = visibleBounds({ scale: 1, tx: -5000, ty: 500 }, { width: 800, height: 600 }) // x 5000…5800 µm
    expect(chunkDetail(chunk, seen, 1)).toBe('outside')
    expect(chunkDetail(chunk, visibleBounds({ scale: 1, tx: 0, ty: 500 }, { width: 800, height: 600 }), 1)).toBe('full')
  })
  it('draws the boxes of pieces under DETAIL_PX and one block under BLOCK_PX', () => {
    expect(chunkDetail(chunk, null, (DETAIL_PX * 1.01) / 150)).toBe('full')
    expect(chunkDetail(chunk, null, (DETAIL_PX * 0.99) / 150)).toBe('boxes')
    expect(chunkDetail(chunk, null, (BLOCK_PX * 0.99) / 1000)).toBe('block')
  })
})
