import type { MultiPolygon, Pair, Polygon, Ring } from 'polygon-clipping'

// Geometry works in the document's world frame: µm, x right, y up. Rings follow polygon-clipping's format
// ([x, y] pairs); merged output has exterior rings counter-clockwise and holes clockwise.
export type { MultiPolygon, Pair, Polygon, Ring }

export type ElementKind = 'channel' | 'component' | 'port' | 'mark' | 'outline'

/** The pieces one element contributes to one layer (each piece a simple, usually convex polygon). */
export interface ElementPieces {
  elementId: string
  kind: ElementKind
  layerId: string
  pieces: Polygon[]
}

/** Something in the document the geometry could not draw as asked (becomes an error finding). */
export interface GeometryProblem {
  rule: 'self-crossing' | 'degenerate-channel' | 'doubles-back' | 'merge-failed'
  elementId: string
  message: string
  location: { x: number; y: number }
}
