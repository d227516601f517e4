export type Severity = 'error' | 'warning' | 'info'

/** One design-rule finding, located in world µm so the canvas can pin it. */
export interface Finding {
  /** Stable id: rule plus the elements involved (same input → same id). */
  id: string
  rule: string
  severity: Severity
  /** Says what is wrong and what to change. */
  message: string
  elements: string[]
  location: { x: number; y: number }
}

/** A fabrication process, as data. Lengths in µm. `sources` says where each value comes from. */
export interface FabricationProcess {
  id: string
  name: string
  material: 'PDMS' | 'glass' | 'thermoplastic'
  minFeature: number
  minGap: number
  minDepth: number
  maxDepth: number
  /** Largest width/depth before a channel roof may sag onto the floor. */
  maxWidthToDepth: number
  /** Largest depth/width of a wall between two channels before it may lean or pair. */
  maxWallDepthToWidth: number
  /** Smallest distance from a punch edge to the chip edge. */
  portEdgeDistance: number
  /** Smallest distance between the edges of two punches. */
  portSpacing: number
  bondPressureLimitMbar: number
  sources: Record<string, string>
}

export const findingId = (rule: string, elements: readonly string[]): string =>
  `${rule}:${[...elements].sort().join('+')}`
