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

/** The rule values of a lab's own process, as the lab keeps them (lengths in µm). */
export type LabProcessData = Omit<FabricationProcess, 'sources'> & { source: string }

/** A lab's process as a rule input: every value carries the lab's source. */
export function labProcess(data: LabProcessData): FabricationProcess & { origin: 'lab' } {
  const { source, ...values } = data
  const cited = `${source} (the lab's library)`
  const sources = Object.fromEntries(
    ['minFeature', 'minGap', 'minDepth', 'maxDepth', 'maxWidthToDepth', 'maxWallDepthToWidth', 'portEdgeDistance', 'portSpacing', 'bondPressureLimitMbar'].map((k) => [k, cited]),
  )
  return { ...values, sources, origin: 'lab' }
}

/** Built-in processes followed by the lab's. */
export function processesWith(lab: readonly LabProcessData[] = []): readonly FabricationProcess[] {
  return lab.length ? [...BUILT_IN_PROCESSES, ...lab.map(labProcess)] : BUILT_IN_PROCESSES
}

/** A process by id among the built-in ones and the lab's. */
export function findProcessIn(id: string, lab: readonly LabProcessData[] = []): FabricationProcess | undefined {
  return processesWith(lab).find((p) => p.id === id)
}

/** The process a revision was checked with, rebuilt from the snapshot stored in its summary (rule values only). */
export function processFromSnapshot(snapshot: { id: string; name: string; values: Record<string, number | string> }): FabricationProcess {
  const { material, ...rest } = snapshot.values
  const numbers = Object.fromEntries(Object.entries(rest).filter(([, v]) => typeof v === 'number')) as Record<string, number>
  const base = BUILT_IN_PROCESSES[0]!
  return { ...base, ...numbers, id: snapshot.id, name: snapshot.name, material: (material as FabricationProcess['material']) ?? base.material, sources: Object.fromEntries(Object.keys(base.sources).map((k) => [k, 'as stored with the revision'])) }
}
