import type { FabricationProcess } from './types'

const COMMON = 'common practice, no source'
const ROOF = 'roof sag in PDMS: Delamarche, Schmid, Michel & Biebuyck 1997, Adv. Mater. 9, 741 (phenomenon); limit value ' + COMMON
const WALL = 'wall pairing/lean of tall thin PDMS features: Delamarche et al. 1997, Adv. Mater. 9, 741 (phenomenon); limit value ' + COMMON

/** Built-in processes. Labs add their own as data of the same shape. */
const FILM_MASK: FabricationProcess = {
  id: 'film-mask-soft-litho',
  name: 'Film-mask soft lithography (PDMS on glass)',
  material: 'PDMS',
  minFeature: 20,
  minGap: 20,
  minDepth: 5,
  maxDepth: 250,
  maxWidthToDepth: 20,
  maxWallDepthToWidth: 4,
  portEdgeDistance: 1000,
  portSpacing: 1000,
  bondPressureLimitMbar: 2000,
  sources: {
    minFeature: COMMON, minGap: COMMON, minDepth: COMMON, maxDepth: COMMON,
    maxWidthToDepth: ROOF, maxWallDepthToWidth: WALL,
    portEdgeDistance: COMMON, portSpacing: COMMON, bondPressureLimitMbar: `plasma-bonded PDMS–glass; ${COMMON}`,
  },
}

/** Built-in processes. Labs add their own as data of the same shape. A chrome mask resolves finer features. */
export const BUILT_IN_PROCESSES: readonly FabricationProcess[] = [
  FILM_MASK,
  { ...FILM_MASK, id: 'chrome-mask-soft-litho', name: 'Chrome-mask soft lithography (PDMS on glass)', minFeature: 3, minGap: 3, minDepth: 2 },
]

export function findProcess(id: string): FabricationProcess | undefined {
  return BUILT_IN_PROCESSES.find((p) => p.id === id)
}
