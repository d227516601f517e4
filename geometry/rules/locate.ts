import Flatbush from 'flatbush'
import type { ElementPieces, Pair } from '../types'
import { closestOnSegment, length, pointInRing, sub } from '../vec'

/** Finds which elements' pieces touch a point (within `tol` µm: merged outlines sit on the 1 nm grid and the merge's closing moves corners by a few nm), through a box index of the pieces. */
export class ElementLocator {
  private readonly index: Flatbush | null
  private readonly owners: { elementId: string; ring: Pair[] }[] = []

  constructor(elements: readonly ElementPieces[]) {
    for (const el of elements)
      for (const piece of el.pieces) if (piece[0]) this.owners.push({ elementId: el.elementId, ring: piece[0] })
    if (this.owners.length === 0) {
      this.index = null
      return
    }
    this.index = new Flatbush(this.owners.length)
    for (const { ring } of this.owners) {
      let x0 = Infinity
      let y0 = Infinity
      let x1 = -Infinity
      let y1 = -Infinity
      for (const [x, y] of ring) {
        x0 = Math.min(x0, x)
        y0 = Math.min(y0, y)
        x1 = Math.max(x1, x)
        y1 = Math.max(y1, y)
      }
      this.index.add(x0, y0, x1, y1)
    }
    this.index.finish()
  }

  elementsAt(p: Pair, tol = 5e-3): string[] {
    if (!this.index) return []
    const found = new Set<string>()
    for (const k of this.index.search(p[0] - tol, p[1] - tol, p[0] + tol, p[1] + tol)) {
      const { elementId, ring } = this.owners[k]!
      if (found.has(elementId)) continue
      if (pointInRing(p, ring) || nearRing(p, ring, tol)) found.add(elementId)
    }
    return [...found].sort()
  }
}

function nearRing(p: Pair, ring: Pair[], tol: number): boolean {
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i]!
    const b = ring[(i + 1) % ring.length]!
    if (length(sub(p, closestOnSegment(p, a, b))) <= tol) return true
  }
  return false
}
