// The lab's own library: liquids (with a temperature table), liquid pairs (interfacial tension per surfactant) and
// fabrication processes (the rule values). Every query is filtered by the caller's lab; another lab's id is 404.
// `labLibraryData` gives the plain data the pure core merges with the built-in entries (mergeLibrary, processesWith).
import { and, asc, count, eq, isNull } from 'drizzle-orm'
import { createError } from 'h3'
import {
  LIQUIDS,
  listLiquids,
  mergeLibrary,
  type LabLiquidData,
  type LabLiquidsData,
  type LabPairData,
} from '#shared/physics/liquids'
import {
  MAX_LIBRARY_ENTRIES,
  pairKey,
  type LibraryEntryCreateBody,
  type LibraryEntryUpdateBody,
  type LibraryEntryView,
  type LibraryKind,
} from '#shared/schemas/libraries'
import { BUILT_IN_PROCESSES, processesWith, type LabProcessData } from '../../geometry/rules/processes'
import { labLibraryEntries, users } from '../db/schema'
import type { LabCaller } from '../utils/access'
import { useDb, type Db } from '../utils/db'
import { useConfig } from '../utils/config'
import { summarizeOffThread } from '../utils/summaryWorker'
import { documentPieceCount, type ChipDocument } from '#shared/schemas/chip'
import { pendingSummary } from './revisionSummary'
import type { RevisionSummary } from '#shared/types/designs'

/** The lab's entries as the core takes them (archived ones left out). */
export interface LabLibraryData extends LabLiquidsData {
  processes: LabProcessData[]
}

export const EMPTY_LAB_LIBRARY: LabLibraryData = { liquids: [], pairs: [], processes: [] }

const notFound = () =>
  createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such library entry in this lab' })
const bad = (message: string, field: string) =>
  createError({ statusCode: 400, statusMessage: 'Bad Request', message, data: { issues: [{ path: field, message }] } })

type Row = typeof labLibraryEntries.$inferSelect

function view(row: Row, updatedByName: string): LibraryEntryView {
  return {
    id: row.id,
    kind: row.kind as LibraryKind,
    key: row.key,
    name: row.name,
    source: row.source,
    values: row.data,
    archived: row.archivedAt !== null,
    updatedAt: row.updatedAt.toISOString(),
    updatedByName,
  }
}

/** Plain data of the lab's open entries, for the forecast and the rules. */
export async function labLibraryData(db: Db, labId: string): Promise<LabLibraryData> {
  const rows = await db
    .select()
    .from(labLibraryEntries)
    .where(and(eq(labLibraryEntries.labId, labId), isNull(labLibraryEntries.archivedAt)))
    .orderBy(asc(labLibraryEntries.createdAt), asc(labLibraryEntries.id))
  const out: LabLibraryData = { liquids: [], pairs: [], processes: [] }
  for (const row of rows) {
    const data = row.data as Record<string, unknown>
    if (row.kind === 'liquid')
      out.liquids.push({ id: row.key, name: row.name, source: row.source, table: data.table as LabLiquidData['table'] })
    else if (row.kind === 'pair')
      out.pairs.push({
        liquids: data.liquids as [string, string],
        surfactant: data.surfactant as string,
        interfacialTensionMNPerM: data.interfacialTensionMNPerM as number,
        source: row.source,
      })
    else if (row.kind === 'process')
      out.processes.push({
        ...(data as Omit<LabProcessData, 'id' | 'name' | 'source'>),
        id: row.key,
        name: row.name,
        source: row.source,
      })
  }
  return out
}

export async function listLibrary(caller: LabCaller): Promise<{ entries: LibraryEntryView[] }> {
  const db = useDb()
  const rows = await db
    .select({ row: labLibraryEntries, by: users.name })
    .from(labLibraryEntries)
    .innerJoin(users, eq(users.id, labLibraryEntries.updatedBy))
    .where(eq(labLibraryEntries.labId, caller.lab.labId))
    .orderBy(asc(labLibraryEntries.kind), asc(labLibraryEntries.name), asc(labLibraryEntries.id))
  return { entries: rows.map(r => view(r.row, r.by)) }
}

/** Key, name, source and the values kept in `data` for a payload. */
function split(body: LibraryEntryCreateBody | LibraryEntryUpdateBody, key: string) {
  if (body.kind === 'liquid') return { key, name: body.name, source: body.source, data: { table: body.table } }
  if (body.kind === 'pair') {
    const data: Omit<LabPairData, 'source'> = {
      liquids: body.liquids,
      surfactant: body.surfactant,
      interfacialTensionMNPerM: body.interfacialTensionMNPerM,
    }
    return {
      key: pairKey(body.liquids, body.surfactant),
      name: `${body.liquids[0]} in ${body.liquids[1]}, ${body.surfactant}`,
      source: body.source,
      data,
    }
  }
  const { kind: _kind, name, source, ...values } = body
  void _kind
  return { key, name, source, data: values }
}

/** A pair may name built-in liquids and the lab's open ones. */
async function checkPairLiquids(db: Db, labId: string, liquids: readonly string[]) {
  const lab = (await labLibraryData(db, labId)).liquids.map(l => l.id)
  const known = new Set([...LIQUIDS.map(l => l.id), ...lab])
  liquids.forEach((id, i) => {
    if (!known.has(id))
      throw bad(
        `liquids[${i}]: "${id}" is neither a built-in liquid nor one of the lab's (add it first, or use one of ${[
          ...known,
        ]
          .slice(0, 12)
          .map(k => `"${k}"`)
          .join(', ')}…)`,
        `liquids.${i}`,
      )
  })
}

function taken(error: unknown, kind: string, key: string): never {
  if (
    (error as { code?: string; cause?: { code?: string } }).code === '23505' ||
    (error as { cause?: { code?: string } }).cause?.code === '23505'
  ) {
    throw createError({
      statusCode: 409,
      statusMessage: 'Conflict',
      message:
        kind === 'pair'
          ? `The lab already has this pair (${key}): edit that entry instead`
          : `The lab already has a ${kind} "${key}": choose another short id`,
    })
  }
  throw error
}

export async function createLibraryEntry(caller: LabCaller, body: LibraryEntryCreateBody): Promise<LibraryEntryView> {
  const db = useDb()
  const labId = caller.lab.labId
  if (body.kind === 'pair') await checkPairLiquids(db, labId, body.liquids)
  if (body.kind === 'process' && BUILT_IN_PROCESSES.some(p => p.id === `lab-${body.key}`))
    throw bad('key: taken by a built-in process', 'key')
  const [{ n }] = (await db
    .select({ n: count() })
    .from(labLibraryEntries)
    .where(eq(labLibraryEntries.labId, labId))) as [{ n: number }]
  if (n >= MAX_LIBRARY_ENTRIES)
    throw createError({
      statusCode: 409,
      statusMessage: 'Conflict',
      message: `The lab's library holds at most ${MAX_LIBRARY_ENTRIES} entries: archive is not enough, edit an existing entry instead`,
    })
  const parts = split(body, body.kind === 'pair' ? '' : `lab-${body.key}`)
  try {
    const [row] = await db
      .insert(labLibraryEntries)
      .values({ labId, kind: body.kind, ...parts, createdBy: caller.userId, updatedBy: caller.userId })
      .returning()
    const [me] = await db.select({ name: users.name }).from(users).where(eq(users.id, caller.userId))
    return view(row!, me?.name ?? '')
  } catch (error) {
    return taken(error, body.kind, parts.key)
  }
}

async function ownEntry(db: Db, caller: LabCaller, entryId: string): Promise<Row> {
  const [row] = await db
    .select()
    .from(labLibraryEntries)
    .where(and(eq(labLibraryEntries.id, entryId), eq(labLibraryEntries.labId, caller.lab.labId)))
  if (!row) throw notFound()
  return row
}

export async function updateLibraryEntry(
  caller: LabCaller,
  entryId: string,
  body: LibraryEntryUpdateBody,
): Promise<LibraryEntryView> {
  const db = useDb()
  const row = await ownEntry(db, caller, entryId)
  if (row.kind !== body.kind)
    throw bad(`kind: this entry is a ${row.kind}; its kind cannot change (add a new entry instead)`, 'kind')
  if (body.kind === 'pair') await checkPairLiquids(db, caller.lab.labId, body.liquids)
  const parts = split(body, row.key)
  try {
    const [updated] = await db
      .update(labLibraryEntries)
      .set({ ...parts, updatedBy: caller.userId, updatedAt: new Date() })
      .where(and(eq(labLibraryEntries.id, entryId), eq(labLibraryEntries.labId, caller.lab.labId)))
      .returning()
    if (!updated) throw notFound()
    const [me] = await db.select({ name: users.name }).from(users).where(eq(users.id, caller.userId))
    return view(updated, me?.name ?? '')
  } catch (error) {
    return taken(error, body.kind, parts.key)
  }
}

export async function archiveLibraryEntry(
  caller: LabCaller,
  entryId: string,
  archived: boolean,
): Promise<LibraryEntryView> {
  const db = useDb()
  await ownEntry(db, caller, entryId)
  const [updated] = await db
    .update(labLibraryEntries)
    .set({ archivedAt: archived ? new Date() : null, updatedBy: caller.userId, updatedAt: new Date() })
    .where(and(eq(labLibraryEntries.id, entryId), eq(labLibraryEntries.labId, caller.lab.labId)))
    .returning()
  if (!updated) throw notFound()
  const [me] = await db.select({ name: users.name }).from(users).where(eq(users.id, caller.userId))
  return view(updated, me?.name ?? '')
}

/** A revision summary computed with the lab's current library (built-in entries plus the lab's open ones). */
export async function summarizeWithLibrary(
  document: ChipDocument,
  processId: string,
  labId: string,
  options: { requireProcess?: boolean; largeInBackground?: boolean } = {},
): Promise<RevisionSummary> {
  const lab = await labLibraryData(useDb(), labId)
  if (options.requireProcess && !processesWith(lab.processes).some(p => p.id === processId)) {
    throw bad(
      `processId: "${processId}" is neither a built-in process nor one of the lab's open processes`,
      'processId',
    )
  }
  // A large chip saves at once with a pending summary; the caller queues the job that fills it (summaryJob.ts).
  if (options.largeInBackground && documentPieceCount(document) > useConfig().geometry.summaryInlinePieces)
    return pendingSummary(document, processId, lab)
  return summarizeOffThread(document, processId, lab)
}

/** GET /api/v1/liquids?lab=…: the built-in library merged with the lab's, and the processes the rules know. */
export async function labLibraryListing(labId: string) {
  const lab = await labLibraryData(useDb(), labId)
  const processes = processesWith(lab.processes).map(p => ({
    id: p.id,
    name: p.name,
    origin: (p as { origin?: 'lab' }).origin ?? 'built-in',
    material: p.material,
    minFeatureUm: p.minFeature,
    bondPressureLimitMbar: p.bondPressureLimitMbar,
  }))
  return { ...listLiquids(mergeLibrary(lab)), processes, labData: lab }
}
