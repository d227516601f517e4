import type { FabricationProcess } from './types'

const COMMON = 'common practice, no source'
const ROOF =
  'roof sag in PDMS: Delamarche, Schmid, Michel & Biebuyck 1997, Adv. Mater. 9, 741 (phenomenon); limit value ' + COMMON
const WALL =
  'wall pairing/lean of tall thin PDMS features: Delamarche et al. 1997, Adv. Mater. 9, 741 (phenomenon); limit value ' +
  COMMON

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
    minFeature: COMMON,
    minGap: COMMON,
    minDepth: COMMON,
    maxDepth: COMMON,
    maxWidthToDepth: ROOF,
    maxWallDepthToWidth: WALL,
    portEdgeDistance: COMMON,
    portSpacing: COMMON,
    bondPressureLimitMbar: `plasma-bonded PDMS–glass; ${COMMON}`,
  },
}

/** Built-in processes. Labs add their own as data of the same shape. A chrome mask resolves finer features. */
export const BUILT_IN_PROCESSES: readonly FabricationProcess[] = [
  FILM_MASK,
  {
    ...FILM_MASK,
    id: 'chrome-mask-soft-litho',
    name: 'Chrome-mask soft lithography (PDMS on glass)',
    minFeature: 3,
    minGap: 3,
    minDepth: 2,
  },
]

export function findProcess(id: string): FabricationProcess | undefined {
  return BUILT_IN_PROCESSES.find(p => p.id === id)
}

/** How a lab's own process id looks ("lab-" and the short id the admin gave it). */
export const LAB_PROCESS_ID = /^lab-[a-z0-9][a-z0-9-]{0,46}$/

/** How a lab process's values cite the lab's source: "measured in our lab (the lab's library)". */
const LAB_CITED = " (the lab's library)"

/** The rule values of a lab's own process, as the lab keeps them (lengths in µm). */
export type LabProcessData = Omit<FabricationProcess, 'sources'> & { source: string }

/** A lab's process as a rule input: every value carries the lab's source. */
export function labProcess(data: LabProcessData): FabricationProcess & { origin: 'lab' } {
  const { source, ...values } = data
  const cited = `${source}${LAB_CITED}`
  const sources = Object.fromEntries(
    [
      'minFeature',
      'minGap',
      'minDepth',
      'maxDepth',
      'maxWidthToDepth',
      'maxWallDepthToWidth',
      'portEdgeDistance',
      'portSpacing',
      'bondPressureLimitMbar',
    ].map(k => [k, cited]),
  )
  return { ...values, sources, origin: 'lab' }
}

/** Built-in processes followed by the lab's. */
export function processesWith(lab: readonly LabProcessData[] = []): readonly FabricationProcess[] {
  return lab.length ? [...BUILT_IN_PROCESSES, ...lab.map(labProcess)] : BUILT_IN_PROCESSES
}

/** A process by id among the built-in ones and the lab's. */
export function findProcessIn(id: string, lab: readonly LabProcessData[] = []): FabricationProcess | undefined {
  return processesWith(lab).find(p => p.id === id)
}

/** A process id resolved among the built-in processes and the lab's; the first built-in one when neither has it. */
export function resolveProcess(id: string | null | undefined, lab: readonly LabProcessData[] = []): FabricationProcess {
  return (id ? findProcessIn(id, lab) : undefined) ?? BUILT_IN_PROCESSES[0]!
}

/** What a revision's summary keeps of the process it was checked with (rule values, lengths in µm). */
export interface ProcessSnapshot {
  id: string
  name: string
  origin: 'built-in' | 'lab'
  values: Record<string, number | string>
  /** The lab's source for its own process (absent for built-in ones and on summaries stored before it was kept). */
  source?: string
}

const RULE_KEYS = [
  'minFeature',
  'minGap',
  'minDepth',
  'maxDepth',
  'maxWidthToDepth',
  'maxWallDepthToWidth',
  'portEdgeDistance',
  'portSpacing',
  'bondPressureLimitMbar',
] as const

/** The snapshot a summary keeps of a process (the values as they are now; never changes with the library). */
export function processSnapshot(process: FabricationProcess): ProcessSnapshot {
  const origin = (process as { origin?: 'lab' }).origin ?? 'built-in'
  const values: Record<string, number | string> = { material: process.material }
  for (const k of RULE_KEYS) values[k] = process[k]
  const snapshot: ProcessSnapshot = { id: process.id, name: process.name, origin, values }
  if (origin === 'lab') snapshot.source = labSourceOf(process)
  return snapshot
}

const labSourceOf = (p: FabricationProcess): string => (p.sources.minFeature ?? '').replace(LAB_CITED, '')

/**
 * The process a revision was checked with, rebuilt from the snapshot stored in its summary (rule values only).
 * A built-in process keeps its own sources; a lab's cites the lab's source as it was stored.
 */
export function processFromSnapshot(snapshot: ProcessSnapshot): FabricationProcess & { origin?: 'lab' } {
  const { material, ...rest } = snapshot.values
  const numbers = Object.fromEntries(Object.entries(rest).filter(([, v]) => typeof v === 'number')) as Record<
    string,
    number
  >
  const builtIn = snapshot.origin === 'lab' ? undefined : findProcess(snapshot.id)
  const base = builtIn ?? BUILT_IN_PROCESSES[0]!
  const cited =
    snapshot.origin === 'lab'
      ? `${snapshot.source ?? "the lab's own values"}; the lab's library, as stored with the revision`
      : 'as stored with the revision'
  const sources = builtIn ? builtIn.sources : Object.fromEntries(Object.keys(base.sources).map(k => [k, cited]))
  const process = {
    ...base,
    ...numbers,
    id: snapshot.id,
    name: snapshot.name,
    material: (material as FabricationProcess['material']) ?? base.material,
    sources,
  }
  return snapshot.origin === 'lab' ? { ...process, origin: 'lab' } : process
}

/**
 * The process of a revision, declared once for every place that shows or checks one (revision page, fab sheets,
 * as-built): the values stored with it, so a later library edit never changes a released chip's sheet; for a
 * summary stored before the snapshot was kept, its process id resolved now among the built-in and the lab's.
 */
export function revisionProcess(
  summary: { processId: string; library?: { process?: ProcessSnapshot } | null },
  lab: readonly LabProcessData[] = [],
): FabricationProcess {
  const snapshot = summary.library?.process
  return snapshot ? processFromSnapshot(snapshot) : resolveProcess(summary.processId, lab)
}

/** The revision's process as lab data, to check another document (an as-built chip) with the same values. */
export function snapshotAsLabData(snapshot: ProcessSnapshot): LabProcessData | null {
  if (snapshot.origin !== 'lab') return null
  const {
    sources: _s,
    origin: _o,
    ...values
  } = processFromSnapshot(snapshot) as FabricationProcess & { origin?: 'lab' }
  void _s
  void _o
  return { ...values, source: snapshot.source ?? "the lab's own values, as stored with the revision" }
}

/** Where the values a sheet prints (smallest feature and gap, depths, bond) come from, in one phrase. */
export const processValuesSource = (p: FabricationProcess): string =>
  p.sources.minFeature ?? 'common practice, no source'
