// A lab's designs: list, create (with its first revision), rename or archive (who may: `canArchive`). Every query
// is scoped to the lab.
import { eq } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, revisions } from '../db/schema'
import { useDb, usePool } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { DesignRow } from '#shared/types/designs'
import { canArchive } from '#shared/utils/roles'
import type { designCreate, designListQuery, designUpdate } from '#shared/schemas/designs'
import type { z } from 'zod'
import { logActivity } from './activity'
import { assertNotArchived, findDesign } from './designGuards'
import { validDocument } from './documents'
import { summarizeOffThread } from '../utils/summaryWorker'
import { starterDocument } from './starterDocument'

// The list is the most read query: plain SQL as a named prepared statement per sort order (planned once per
// connection), every filter a nullable parameter.
const ORDER = { updated: 'd.updated_at', name: 'd.name', created: 'd.created_at' } as const
const LIST_SQL = (order: string, dir: string) => `
  select d.id, d.name, d.description, d.process_id, d.junction_kinds, d.latest_revision_id, d.updated_at,
         d.archived_at is not null as archived, d.origin, r.number, r.status, u.name as author_name
    from designs d
    left join revisions r on r.id = d.latest_revision_id
    left join users u on u.id = r.author_id
   where d.lab_id = $1 and (d.archived_at is not null) = $2
     and ($3::text is null or d.name ilike $3) and ($4::revision_status is null or r.status = $4)
     and ($5::text is null or $5 = any(d.junction_kinds))
   order by ${order} ${dir}, d.id limit 500`

interface ListRow { id: string, name: string, description: string, process_id: string, junction_kinds: string[], latest_revision_id: string | null, updated_at: Date, archived: boolean, origin: DesignRow['origin'], number: number | null, status: DesignRow['status'], author_name: string | null }

export async function listDesigns(caller: LabCaller, query: z.infer<typeof designListQuery>): Promise<DesignRow[]> {
  const like = query.q ? `%${query.q.replace(/[%_\\]/g, m => `\\${m}`)}%` : null
  const { rows } = await usePool().query<ListRow>({
    name: `dw-designs-${query.sort}-${query.dir}`,
    text: LIST_SQL(ORDER[query.sort], query.dir === 'asc' ? 'asc' : 'desc'),
    values: [caller.lab.labId, query.archived === 'true', like, query.status ?? null, query.kind ?? null],
  })
  return rows.map(r => ({
    id: r.id, name: r.name, description: r.description, processId: r.process_id, junctionKinds: r.junction_kinds,
    latestRevisionId: r.latest_revision_id, latestNumber: r.number, status: r.status,
    updatedAt: r.updated_at.toISOString(), authorName: r.author_name ?? '', archived: r.archived, origin: r.origin ?? null,
  }))
}

export async function createDesign(caller: LabCaller, body: z.infer<typeof designCreate>) {
  const document = body.document === undefined ? starterDocument(body.name) : validDocument(body.document)
  const processId = body.processId ?? 'film-mask-soft-litho'
  const summary = await summarizeOffThread(document, processId)
  return useDb().transaction(async (tx) => {
    const [design] = await tx.insert(designs).values({
      labId: caller.lab.labId, name: body.name, description: body.description, processId, createdBy: caller.userId, revisionCount: 1,
      junctionKinds: summary.junctionKinds,
    }).returning()
    const [revision] = await tx.insert(revisions).values({
      designId: design!.id, labId: caller.lab.labId, number: 1, authorId: caller.userId, message: body.message, document, summary,
    }).returning({ id: revisions.id })
    await tx.update(designs).set({ latestRevisionId: revision!.id }).where(eq(designs.id, design!.id))
    await logActivity(tx, { labId: caller.lab.labId, designId: design!.id, revisionId: revision!.id, actorId: caller.userId, action: 'design.created', detail: { name: body.name } })
    return { designId: design!.id, revisionId: revision!.id }
  })
}

export async function updateDesign(caller: LabCaller, designId: string, body: z.infer<typeof designUpdate>) {
  const db = useDb()
  const design = await findDesign(db, caller, designId)
  if (body.archived !== undefined && !canArchive(caller.lab.role, caller.userId, design.createdBy)) {
    throw createError({ statusCode: 403, statusMessage: 'Forbidden', message: `Your role (${caller.lab.role}) may archive or restore only designs you created` })
  }
  // Archived is read-only: a rename or new description waits until the design is restored (in the same call is fine).
  if (body.archived !== false && (body.name !== undefined || body.description !== undefined)) assertNotArchived(design)
  return db.transaction(async (tx) => {
    const set: Partial<typeof designs.$inferInsert> = { updatedAt: new Date() }
    if (body.name !== undefined) set.name = body.name
    if (body.description !== undefined) set.description = body.description
    if (body.archived !== undefined) set.archivedAt = body.archived ? new Date() : null
    await tx.update(designs).set(set).where(eq(designs.id, design.id))
    const action = body.archived === true ? 'design.archived' : body.archived === false ? 'design.restored' : 'design.renamed'
    await logActivity(tx, { labId: caller.lab.labId, designId, actorId: caller.userId, action, detail: { name: body.name ?? design.name } })
    return { ok: true }
  })
}
