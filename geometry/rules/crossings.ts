import Flatbush from 'flatbush'
import type { ChipDocument } from '#shared/schemas/chip'
import type { Pair } from '../types'
import { cross, sub } from '../vec'
import type { Finding } from './types'
import { findingId } from './types'

// Two channels drawn across each other on one layer become one open junction on the mask: the liquids meet there
// and the network the forecast solves no longer matches the chip. A proper crossing of their centre lines (each
// passes through the other's interior) is an error; channels that only meet at an end point are joins, handled by
// terminals. Crossing test: orientation signs (Cormen et al., Introduction to Algorithms, §33.1).

interface Segment {
  channel: string
  layerId: string
  a: Pair
  b: Pair
}

/** Where segments ab and cd cross properly (each strictly through the other), or null. */
export function properCrossing(a: Pair, b: Pair, c: Pair, d: Pair): Pair | null {
  const r = sub(b, a)
  const s = sub(d, c)
  const denom = cross(r, s)
  if (denom === 0) return null // parallel or collinear: overlaps are the spacing rule's business
  const t = cross(sub(c, a), s) / denom
  const u = cross(sub(c, a), r) / denom
  const eps = 1e-9
  if (t <= eps || t >= 1 - eps || u <= eps || u >= 1 - eps) return null
  return [a[0] + t * r[0], a[1] + t * r[1]]
}

export function crossingFindings(doc: ChipDocument): Finding[] {
  const segments: Segment[] = []
  for (const ch of doc.channels) {
    for (let i = 0; i + 1 < ch.points.length; i++) {
      const p = ch.points[i]!
      const q = ch.points[i + 1]!
      segments.push({ channel: ch.id, layerId: ch.layerId, a: [p.x, p.y], b: [q.x, q.y] })
    }
  }
  if (segments.length < 2) return []
  const index = new Flatbush(segments.length)
  for (const s of segments)
    index.add(Math.min(s.a[0], s.b[0]), Math.min(s.a[1], s.b[1]), Math.max(s.a[0], s.b[0]), Math.max(s.a[1], s.b[1]))
  index.finish()
  const seen = new Map<string, Finding>()
  segments.forEach((s, i) => {
    const hits = index.search(
      Math.min(s.a[0], s.b[0]),
      Math.min(s.a[1], s.b[1]),
      Math.max(s.a[0], s.b[0]),
      Math.max(s.a[1], s.b[1]),
    )
    for (const j of hits) {
      const o = segments[j]!
      if (j <= i || o.channel === s.channel || o.layerId !== s.layerId) continue
      const at = properCrossing(s.a, s.b, o.a, o.b)
      if (!at) continue
      const elements = [s.channel, o.channel].sort()
      const id = findingId('channel-crossing', elements)
      if (seen.has(id)) continue
      seen.set(id, {
        id,
        rule: 'channel-crossing',
        severity: 'error',
        elements,
        location: { x: at[0], y: at[1] },
        message: `Channels "${elements[0]}" and "${elements[1]}" cross at (${at[0].toFixed(0)}, ${at[1].toFixed(0)}) µm on layer "${s.layerId}": on one layer a crossing joins them; reroute one around the other or move it to another layer`,
      })
    }
  })
  return [...seen.values()]
}
