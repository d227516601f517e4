import type { ChipOutlines } from '../outlines'
import { DBU_PER_UM } from '../units'
import { collectEdges, indexEdges } from './edges'
import { ElementLocator } from './locate'
import { confirmBySizing, sizingRegions } from './sizing'
import { spacingAllPairs, spacingWithIndex } from './spacing'
import type { SpacingHit } from './spacing'
import type { FabricationProcess, Finding } from './types'
import { findingId } from './types'

/**
 * Measurements at exactly the limit pass; two database units (2 nm) absorb the rounding of both edges onto the
 * 1 nm grid after a rotation (each vertex moves ≤ 0.71 nm) (µm).
 */
const TOL = 2 / DBU_PER_UM
const r1 = (x: number) => (Math.round(x * 10) / 10).toString()

/** How width and gap are checked: by sizing (default) or by edge pairs alone (the reference). */
export type SpacingMethod = 'sizing' | 'edges'

/**
 * Minimum width, minimum gap and tall-thin-wall findings on the merged outlines of every layer.
 * `sizing` (default): the regions an opening by half the minimum width removes and a closing by half the
 * largest gap limit fills (sizing.ts) decide where a rule is broken; the closest edge pair in each region gives
 * the distance, the elements and the location. `edges`: every edge pair closer than the limit (the reference
 * the tests compare against). `naive` uses the all-pairs search (benchmark only); results are identical.
 */
export function spacingFindings(
  o: ChipOutlines,
  process: FabricationProcess,
  naive = false,
  method: SpacingMethod = 'sizing',
): Finding[] {
  const best = new Map<string, Finding & { d: number }>()
  for (const layer of o.layers) {
    const wallGap = layer.depth / process.maxWallDepthToWidth
    const limit = Math.max(process.minGap, process.minFeature, wallGap)
    const edges = collectEdges(layer.polygons)
    const all: SpacingHit[] = naive ? spacingAllPairs(edges, limit) : spacingWithIndex(edges, indexEdges(edges), limit)
    const hits =
      method === 'sizing' && all.length > 0
        ? confirmBySizing(all, sizingRegions(layer.polygons, process.minFeature, Math.max(process.minGap, wallGap)))
        : all
    if (hits.length === 0) continue
    const locator = new ElementLocator(o.elements.filter(e => e.layerId === layer.layerId))
    for (const h of hits) {
      const finding = classify(h, layer.depth, layer.layerId, process, wallGap)
      if (!finding) continue
      const elements = [...new Set([...locator.elementsAt(h.p), ...locator.elementsAt(h.q)])].sort()
      const id = `${findingId(finding.rule, elements)}@${layer.layerId}`
      const prev = best.get(id)
      if (prev && prev.d <= h.distance) continue
      const location = { x: (h.p[0] + h.q[0]) / 2, y: (h.p[1] + h.q[1]) / 2 }
      best.set(id, { id, ...finding, elements, location, d: h.distance })
    }
  }
  return [...best.values()].map(({ d: _d, ...f }) => f)
}

function classify(
  h: SpacingHit,
  depth: number,
  layerId: string,
  p: FabricationProcess,
  wallGap: number,
): Pick<Finding, 'rule' | 'severity' | 'message'> | null {
  const d = r1(h.distance)
  if (h.kind === 'width') {
    if (h.distance >= p.minFeature - TOL) return null
    return {
      rule: 'min-width',
      severity: 'error',
      message: `Feature is ${d} µm wide on layer "${layerId}", below the process minimum of ${p.minFeature} µm: widen it to at least ${p.minFeature} µm`,
    }
  }
  if (h.distance < p.minGap - TOL) {
    return {
      rule: 'min-gap',
      severity: 'error',
      message: `Gap of ${d} µm on layer "${layerId}", below the process minimum of ${p.minGap} µm: move the features at least ${p.minGap} µm apart`,
    }
  }
  if (h.distance < wallGap - TOL) {
    return {
      rule: 'tall-thin-wall',
      severity: 'warning',
      message: `Wall of ${d} µm between features on the ${depth} µm deep layer "${layerId}" is taller than ${p.maxWallDepthToWidth}× its width and may lean or collapse: make it at least ${r1(wallGap)} µm thick`,
    }
  }
  return null
}
