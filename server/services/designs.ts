// A lab's designs: list, create (with its first revision), rename or archive (who may: `canArchive`). Every query
// is scoped to the lab.
import { and, asc, desc, eq, sql } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, revisions, users } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { DesignRow } from '#shared/types/designs'
import { canArchive } from '#shared/utils/roles'
import type { designCreate, designListQuery, designUpdate } from '#shared/schemas/designs'
import type { z } from 'zod'
import { logActivity } from './activity'
import { assertNotArchived, findDesign } from './designGuards'
import { validDocument } from './documents'
import { summarizeWithLibrary } from './libraries'
import { queueSummaryIfPending } from './summaryJob'
import { starterDocument } from './starterDocument'

// The list is the most read query: a named prepared statement per sort order, with or without a search (planned
// once per connection), the other filters nullable placeholders, one page at a time (offset + limit) with the total
// counted by a second prepared statement on the same filters. The page is a deferred join: its ids come off `designs` alone, walking the index
// `designs_lab_<sort>_idx` (lab, sort key, id) past the skipped rows, and only those 50 rows are joined to their
// revision and author (joining first made page 100 of a 10,000-design lab hash all the lab's revisions: 28 ms
// alone, ~280 ms p95 at 20 connections). The status filter is an EXISTS on the latest revision's primary key.
const ORDER = { updated: designs.updatedAt, name: designs.name, created: designs.createdAt } as const
type ListQuery = z.infer<typeof designListQuery>
const like = sql.placeholder('like')
const status = sql.placeholder('status')
const kind = sql.placeholder('kind')

/** The list's filters; with `search` the name must match `like` (a statement of its own, so its plan can use the
 * trigram index, which a `like is null or …` test in a generic plan never would). */
function listFilters(search: boolean) {
  return [
    eq(designs.labId, sql.placeholder('labId')),
    sql`(${designs.archivedAt} is not null) = ${sql.placeholder('archived')}`,
    ...(search ? [sql`${designs.name} ilike ${like}`] : []),
    sql`(${kind}::text is null or ${kind} = any(${designs.junctionKinds}))`,
    sql`(${status}::revision_status is null or exists (select 1 from ${revisions} where ${revisions.id} = ${designs.latestRevisionId} and ${revisions.status} = ${status}))`,
  ]
}

function prepareList(sort: ListQuery['sort'], dir: 'asc' | 'desc', search: boolean) {
  const db = useDb()
  const by = (column: Parameters<typeof asc>[0]) => (dir === 'asc' ? asc(column) : desc(column))
  // A search counts its matches in the same pass (a window count, taken before the limit): it reads them all
  // anyway, so a second statement would read them again. Without a search the page stops at its limit and the
  // total comes from the count statement.
  const total = search ? sql<number>`(count(*) over ())::int` : sql<number | null>`null::int`
  const page = db
    .select({ id: designs.id, total: total.as('total') })
    .from(designs)
    .where(and(...listFilters(search)))
    .orderBy(by(ORDER[sort]), by(designs.id))
    .limit(sql.placeholder('limit'))
    .offset(sql.placeholder('offset'))
    .as('page')
  return db
    .select({
      id: designs.id,
      name: designs.name,
      description: designs.description,
      processId: designs.processId,
      junctionKinds: designs.junctionKinds,
      latestRevisionId: designs.latestRevisionId,
      latestNumber: revisions.number,
      status: revisions.status,
      updatedAt: designs.updatedAt,
      authorName: users.name,
      archived: sql<boolean>`${designs.archivedAt} is not null`,
      origin: designs.origin,
      total: page.total,
    })
    .from(page)
    .innerJoin(designs, eq(designs.id, page.id))
    .leftJoin(revisions, eq(revisions.id, designs.latestRevisionId))
    .leftJoin(users, eq(users.id, revisions.authorId))
    .orderBy(by(ORDER[sort]), by(designs.id))
    .prepare(`dw_designs_${sort}_${dir}${search ? '_q' : ''}`)
}
const lists = new Map<string, ReturnType<typeof prepareList>>()

const prepareCount = (search: boolean) =>
  useDb()
    .select({ total: sql<number>`count(*)::int` })
    .from(designs)
    .where(and(...listFilters(search)))
    .prepare(`dw_designs_count${search ? '_q' : ''}`)
const counts = new Map<boolean, ReturnType<typeof prepareCount>>()

export interface DesignPage {
  rows: DesignRow[]
  total: number
  page: number
  pageSize: number
}

export async function listDesigns(caller: LabCaller, query: ListQuery): Promise<DesignPage> {
  const dir = query.dir === 'asc' ? 'asc' : 'desc'
  const search = Boolean(query.q)
  const key = `${query.sort}-${dir}-${search}`
  const list = lists.get(key) ?? lists.set(key, prepareList(query.sort, dir, search)).get(key)!
  const count = counts.get(search) ?? counts.set(search, prepareCount(search)).get(search)!
  const filters = {
    labId: caller.lab.labId,
    archived: query.archived === 'true',
    kind: query.kind ?? null,
    like: query.q ? `%${query.q.replace(/[%_\\]/g, m => `\\${m}`)}%` : null,
    status: query.status ?? null,
  }
  const page = { ...filters, limit: query.pageSize, offset: (query.page - 1) * query.pageSize }
  const [rows, counted] = search
    ? await list.execute(page).then(async rows => [rows, rows[0] ?? (await count.execute(filters))[0]] as const)
    : await Promise.all([list.execute(page), count.execute(filters).then(([c]) => c)])
  return {
    rows: rows.map(({ total: _, ...r }) => ({
      ...r,
      updatedAt: r.updatedAt.toISOString(),
      authorName: r.authorName ?? '',
      origin: r.origin ?? null,
    })),
    total: counted?.total ?? 0,
    page: query.page,
    pageSize: query.pageSize,
  }
}

export async function createDesign(caller: LabCaller, body: z.infer<typeof designCreate>) {
  const document = body.document === undefined ? starterDocument(body.name, body.starter) : validDocument(body.document)
  const processId = body.processId ?? 'film-mask-soft-litho'
  const summary = await summarizeWithLibrary(document, processId, caller.lab.labId, {
    requireProcess: true,
    largeInBackground: true,
  })
  return useDb().transaction(async tx => {
    const [design] = await tx
      .insert(designs)
      .values({
        labId: caller.lab.labId,
        name: body.name,
        description: body.description,
        processId,
        createdBy: caller.userId,
        revisionCount: 1,
        junctionKinds: summary.junctionKinds,
      })
      .returning()
    const [revision] = await tx
      .insert(revisions)
      .values({
        designId: design!.id,
        labId: caller.lab.labId,
        number: 1,
        authorId: caller.userId,
        message: body.message,
        document,
        summary,
      })
      .returning({ id: revisions.id })
    await tx.update(designs).set({ latestRevisionId: revision!.id }).where(eq(designs.id, design!.id))
    await queueSummaryIfPending(tx, summary, { labId: caller.lab.labId, revisionId: revision!.id })
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: design!.id,
      revisionId: revision!.id,
      actorId: caller.userId,
      action: 'design.created',
      detail: { name: body.name },
    })
    return { designId: design!.id, revisionId: revision!.id }
  })
}

export async function updateDesign(caller: LabCaller, designId: string, body: z.infer<typeof designUpdate>) {
  const db = useDb()
  const design = await findDesign(db, caller, designId)
  if (body.archived !== undefined && !canArchive(caller.lab.role, caller.userId, design.createdBy)) {
    throw createError({
      statusCode: 403,
      statusMessage: 'Forbidden',
      message: `Your role (${caller.lab.role}) may archive or restore only designs you created`,
    })
  }
  // Archived is read-only: a rename or new description waits until the design is restored (in the same call is fine).
  if (body.archived !== false && (body.name !== undefined || body.description !== undefined)) assertNotArchived(design)
  return db.transaction(async tx => {
    const set: Partial<typeof designs.$inferInsert> = { updatedAt: new Date() }
    if (body.name !== undefined) set.name = body.name
    if (body.description !== undefined) set.description = body.description
    if (body.archived !== undefined) set.archivedAt = body.archived ? new Date() : null
    await tx.update(designs).set(set).where(eq(designs.id, design.id))
    const action =
      body.archived === true ? 'design.archived' : body.archived === false ? 'design.restored' : 'design.renamed'
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId,
      actorId: caller.userId,
      action,
      detail: { name: body.name ?? design.name },
    })
    return { ok: true }
  })
}
