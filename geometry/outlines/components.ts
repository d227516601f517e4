import type { Component } from '#shared/schemas/chip'
import { stepArrayLength } from '#shared/schemas/chip'
import type { Polygon } from '../types'
import { circlePolygon } from './circle'
import { strokePolyline } from './polyline'
import { place, rect } from './shapes'
import { serpentinePieces } from './serpentine'

export interface LayerPieces {
  layerId: string
  pieces: Polygon[]
}

/**
 * Local-frame pieces of each component kind, per layer. The frames and arm ends match the terminal table in
 * shared/schemas/chip/terminals.ts, so channels attached to terminals meet the arms edge to edge.
 */
function localPieces(c: Component, tolerance: number): LayerPieces[] {
  switch (c.kind) {
    case 't-junction': {
      const a = c.armLength
      return [
        {
          layerId: c.layerId,
          pieces: [rect(-a, a, -c.mainWidth / 2, c.mainWidth / 2), rect(-c.inletWidth / 2, c.inletWidth / 2, 0, a)],
        },
      ]
    }
    case 'flow-focusing': {
      const a = c.armLength
      const x0 = c.continuousWidth / 2
      const x1 = x0 + c.orificeLength
      return [
        {
          layerId: c.layerId,
          pieces: [
            rect(-a, 0, -c.dispersedWidth / 2, c.dispersedWidth / 2),
            rect(-x0, x0, -a, a),
            rect(x0, x1, -c.orificeWidth / 2, c.orificeWidth / 2),
            rect(x1, x1 + a, -c.outletWidth / 2, c.outletWidth / 2),
          ],
        },
      ]
    }
    case 'y-junction': {
      const pieces: Polygon[] = []
      const arm = (deg: number, w: number) => {
        const r = (deg * Math.PI) / 180
        const s = strokePolyline(
          [
            [0, 0],
            [c.armLength * Math.cos(r), c.armLength * Math.sin(r)],
          ],
          w,
        )
        if (s.ok) pieces.push(...s.pieces)
      }
      arm(180 - c.angle / 2, c.continuousWidth)
      arm(180 + c.angle / 2, c.dispersedWidth)
      arm(0, c.outletWidth)
      // The hub where the arms meet: a disc as wide as the widest arm closes the notch between them.
      pieces.push(circlePolygon([0, 0], Math.max(c.continuousWidth, c.dispersedWidth, c.outletWidth) / 2, tolerance))
      return [{ layerId: c.layerId, pieces }]
    }
    case 'step-nozzle':
      return [
        { layerId: c.layerId, pieces: [rect(0, c.nozzleLength, -c.nozzleWidth / 2, c.nozzleWidth / 2)] },
        {
          layerId: c.reservoirLayerId,
          pieces: [
            rect(c.nozzleLength, c.nozzleLength + c.reservoirWidth, -c.reservoirLength / 2, c.reservoirLength / 2),
          ],
        },
      ]
    case 'step-array': {
      const half = stepArrayLength(c) / 2
      const nozzles: Polygon[] = []
      for (let i = 0; i < c.nozzleCount; i++) {
        const y = -half + c.margin + i * c.pitch
        nozzles.push(rect(0, c.nozzleLength, y - c.nozzleWidth / 2, y + c.nozzleWidth / 2))
      }
      const out: LayerPieces[] = [
        { layerId: c.supplyLayerId, pieces: [rect(-c.supplyWidth, 0, -half, half)] },
        { layerId: c.layerId, pieces: nozzles },
        { layerId: c.reservoirLayerId, pieces: [rect(c.nozzleLength, c.nozzleLength + c.reservoirWidth, -half, half)] },
      ]
      return out
    }
    case 'serpentine':
      return [{ layerId: c.layerId, pieces: serpentinePieces(c, tolerance) }]
  }
}

/** World-frame pieces of a component, grouped by layer. */
export function componentPieces(c: Component, tolerance: number): LayerPieces[] {
  const byLayer = new Map<string, Polygon[]>()
  for (const { layerId, pieces } of localPieces(c, tolerance)) {
    const list = byLayer.get(layerId) ?? []
    list.push(...pieces.map(p => place(p, c.position, c.rotation)))
    byLayer.set(layerId, list)
  }
  return [...byLayer].map(([layerId, pieces]) => ({ layerId, pieces }))
}
