import type { Serpentine } from '#shared/schemas/chip'
import { serpentineRunLength } from '#shared/schemas/chip'
import type { Pair, Polygon } from '../types'
import { arcPoints } from './circle'
import { annularSector, rect } from './shapes'

/**
 * Local pieces of a serpentine: `turns + 1` straight runs (rectangles) and one half-annulus per U-turn
 * (inner radius pitch/2 − width/2, outer pitch/2 + width/2), so the centre line has the stated total length.
 */
export function serpentinePieces(c: Serpentine, tolerance: number): Polygon[] {
  const run = serpentineRunLength(c)
  const h = c.width / 2
  const r = c.pitch / 2
  const pieces: Polygon[] = []
  for (let k = 0; k <= c.turns; k++) pieces.push(rect(0, run, k * c.pitch - h, k * c.pitch + h))
  for (let k = 0; k < c.turns; k++) {
    const center: Pair = [k % 2 === 0 ? run : 0, k * c.pitch + r]
    const [a0, a1] = k % 2 === 0 ? [-Math.PI / 2, Math.PI / 2] : [Math.PI / 2, (3 * Math.PI) / 2]
    pieces.push(annularSector(arcPoints(center, r + h, a0, a1, tolerance), arcPoints(center, r - h, a0, a1, tolerance)))
  }
  return pieces
}
