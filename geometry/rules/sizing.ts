import Flatbush from 'flatbush'
import { Clipper, PointInPolygonResult, type Path64, type Paths64 } from 'clipper2-ts'
import { differencePaths, sizePaths, toPaths } from '../clip'
import type { MultiPolygon, Pair } from '../types'
import { toDbu } from '../units'
import type { SpacingHit } from './spacing'

/**
 * Regions of a layer that break a width or a gap rule, by sizing — the mask-industry way of checking widths
 * and spaces with offsets (e.g. the SIZE operation of layout rule decks; common practice, no source):
 *
 * - too narrow: shrink by half the minimum width and grow back (a morphological opening); what the opening
 *   loses is narrower than the minimum: `narrow = P − grow(shrink(P, w/2), w/2)`;
 * - too close: grow by half the minimum gap and shrink back (a closing); what the closing fills is a space
 *   narrower than the gap: `close = shrink(grow(P, g/2), g/2) − P`.
 *
 * Offsets are mitred up to 2× the distance (a right angle comes back exactly); all on the 1 nm grid.
 */
export interface SizingRegions {
  narrow: RegionSet
  close: RegionSet
}

export function sizingRegions(mp: MultiPolygon, minWidth: number, minGap: number): SizingRegions {
  const p = toPaths(mp)
  const hw = toDbu(minWidth / 2)
  const hg = toDbu(minGap / 2)
  const opened = hw > 0 ? sizePaths(sizePaths(p, -hw), hw) : p
  const closed = hg > 0 ? sizePaths(sizePaths(p, hg), -hg) : p
  return { narrow: new RegionSet(differencePaths(p, opened)), close: new RegionSet(differencePaths(closed, p)) }
}

/** Difference polygons with a box index; a point is in the set by the non-zero winding of its paths. */
export class RegionSet {
  readonly paths: Paths64
  private readonly sign: number[]
  private readonly index: Flatbush | null

  constructor(paths: Paths64) {
    this.paths = paths
    this.sign = paths.map(q => Math.sign(Clipper.area(q)))
    if (paths.length === 0) {
      this.index = null
      return
    }
    this.index = new Flatbush(paths.length)
    for (const q of paths) {
      const b = Clipper.getBounds(q)
      this.index.add(b.left, b.top, b.right, b.bottom)
    }
    this.index.finish()
  }

  get count(): number {
    return this.paths.length
  }

  /** True when the µm point lies in (or on the edge of, within `slack` database units) a region. */
  contains(pt: Pair, slack = 2): boolean {
    if (!this.index) return false
    const x = toDbu(pt[0])
    const y = toDbu(pt[1])
    let winding = 0
    let near = false
    for (const k of this.index.search(x - slack, y - slack, x + slack, y + slack)) {
      const path: Path64 = this.paths[k]!
      const r = Clipper.pointInPolygon({ x, y }, path)
      if (r === PointInPolygonResult.IsOn) return true
      if (r === PointInPolygonResult.IsInside) winding += this.sign[k]!
      else near ||= slack > 0 && nearPath(x, y, path, slack)
    }
    return winding > 0 || near
  }
}

function nearPath(x: number, y: number, path: Path64, slack: number): boolean {
  for (let i = 0; i < path.length; i++) {
    const a = path[i]!
    const b = path[(i + 1) % path.length]!
    const dx = b.x - a.x
    const dy = b.y - a.y
    const l2 = dx * dx + dy * dy
    const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((x - a.x) * dx + (y - a.y) * dy) / l2))
    if (Math.hypot(a.x + t * dx - x, a.y + t * dy - y) <= slack) return true
  }
  return false
}

/**
 * The hits that sizing confirms: a width where the opening lost material, a gap where the closing filled
 * space, each tested at the midpoint of its closest pair. Sizing decides where a rule is broken; the edge pair
 * inside the region gives the measured distance for the message. A region with no edge pair below the limit
 * is the opening's squared-off acute tip (a known false alarm of sizing at sharp corners) and is not reported.
 */
export function confirmBySizing(hits: readonly SpacingHit[], regions: SizingRegions): SpacingHit[] {
  return hits.filter(h => {
    const mid: Pair = [(h.p[0] + h.q[0]) / 2, (h.p[1] + h.q[1]) / 2]
    return (h.kind === 'width' ? regions.narrow : regions.close).contains(mid, CONFIRM_SLACK)
  })
}

/**
 * How far (database units) a hit's midpoint may lie outside its region and still be confirmed: the edge pair of
 * two parallel edges is measured at their ends, and where such a channel meets a punch the opening leaves a
 * notch a fraction of a micrometre deep there (a 10 µm channel into a 1 mm outlet: 0.1 µm). 1 µm is our own
 * choice, far below any feature the rules measure.
 */
const CONFIRM_SLACK = toDbu(1)
