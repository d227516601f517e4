import type { ChipDocument } from '#shared/schemas/chip'
import type { ChipOutlines } from '../outlines'
import type { Pair } from '../types'
import { closestOnSegment, length, pointInRing, sub } from '../vec'
import type { FabricationProcess, Finding } from './types'
import { findingId } from './types'

const r1 = (x: number) => (Math.round(x * 10) / 10).toString()

function distanceToRing(p: Pair, ring: Pair[]): number {
  let d = Infinity
  for (let i = 0; i < ring.length; i++)
    d = Math.min(d, length(sub(p, closestOnSegment(p, ring[i]!, ring[(i + 1) % ring.length]!))))
  return d
}

/** Elements outside the chip outline, punches too near the edge or each other. */
export function placementFindings(doc: ChipDocument, o: ChipOutlines, p: FabricationProcess): Finding[] {
  const out: Finding[] = []
  const ring = o.chipOutline
  if (!ring) {
    out.push({
      id: 'no-outline',
      rule: 'no-outline',
      severity: 'info',
      elements: [],
      location: { x: 0, y: 0 },
      message: 'The design has no chip outline, so edges and port margins were not checked: draw the chip outline',
    })
  } else {
    const reported = new Set<string>()
    for (const el of o.elements) {
      if (reported.has(el.elementId)) continue
      const outside = el.pieces
        .flatMap(piece => piece[0] ?? [])
        .find(v => !pointInRing(v, ring) && distanceToRing(v, ring) > 1e-6)
      if (outside) {
        reported.add(el.elementId)
        out.push({
          id: findingId('outside-outline', [el.elementId]),
          rule: 'outside-outline',
          severity: 'error',
          elements: [el.elementId],
          location: { x: outside[0], y: outside[1] },
          message: `"${el.elementId}" reaches outside the chip outline at (${r1(outside[0])}, ${r1(outside[1])}) µm: move it inside or enlarge the outline`,
        })
      }
    }
    for (const port of doc.ports) {
      const c: Pair = [port.position.x, port.position.y]
      if (!pointInRing(c, ring)) continue // already reported as outside
      const edge = distanceToRing(c, ring) - port.punchDiameter / 2
      if (edge < p.portEdgeDistance - 1e-6) {
        out.push({
          id: findingId('port-edge', [port.id]),
          rule: 'port-edge',
          severity: 'warning',
          elements: [port.id],
          location: { ...port.position },
          message: `Punch of port "${port.id}" is ${r1(edge)} µm from the chip edge, under the ${p.portEdgeDistance} µm this process needs: move it further in`,
        })
      }
    }
  }
  // Punch-to-punch spacing (ports are few: all pairs).
  for (let i = 0; i < doc.ports.length; i++) {
    for (let j = i + 1; j < doc.ports.length; j++) {
      const a = doc.ports[i]!
      const b = doc.ports[j]!
      const gap =
        Math.hypot(a.position.x - b.position.x, a.position.y - b.position.y) - (a.punchDiameter + b.punchDiameter) / 2
      if (gap < p.portSpacing - 1e-6) {
        const elements = [a.id, b.id].sort()
        out.push({
          id: findingId('port-spacing', elements),
          rule: 'port-spacing',
          severity: gap < 0 ? 'error' : 'warning',
          elements,
          location: { x: (a.position.x + b.position.x) / 2, y: (a.position.y + b.position.y) / 2 },
          message: `Punches of ports "${a.id}" and "${b.id}" are ${r1(gap)} µm apart (edge to edge), under the ${p.portSpacing} µm this process needs: move them apart`,
        })
      }
    }
  }
  return out
}
