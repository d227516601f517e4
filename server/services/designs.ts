// A lab's designs: list, create (with its first revision), rename or archive. Every query is scoped to the lab.
import { and, asc, desc, eq, ilike, isNotNull, isNull, sql } from 'drizzle-orm'
import { designs, revisions, users } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { DesignRow } from '../../shared/types/designs'
import type { designCreate, designListQuery, designUpdate } from '../../shared/schemas/designs'
import type { z } from 'zod'
import { logActivity } from './activity'
import { findDesign } from './designGuards'
import { validDocument } from './documents'
import { summarizeRevision } from './revisionSummary'
import { starterDocument } from './starterDocument'


export async function listDesigns(caller: LabCaller, query: z.infer<typeof designListQuery>): Promise<DesignRow[]> {
  const order = { updated: designs.updatedAt, name: designs.name, created: designs.createdAt }[query.sort]
  const rows = await useDb().select({
    design: designs, authorName: users.name, number: revisions.number, status: revisions.status,
  }).from(designs)
    .leftJoin(revisions, eq(revisions.id, designs.latestRevisionId))
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(and(
      eq(designs.labId, caller.lab.labId),
      query.archived === 'true' ? isNotNull(designs.archivedAt) : isNull(designs.archivedAt),
      query.q ? ilike(designs.name, `%${query.q.replace(/[%_\\]/g, m => `\\${m}`)}%`) : undefined,
      query.status ? eq(revisions.status, query.status) : undefined,
      query.kind ? sql`${query.kind} = any(${designs.junctionKinds})` : undefined,
    ))
    .orderBy(query.dir === 'asc' ? asc(order) : desc(order), asc(designs.id))
    .limit(500)
  return rows.map(({ design, authorName, number, status }) => ({
    id: design.id, name: design.name, description: design.description, processId: design.processId,
    junctionKinds: design.junctionKinds,
    latestRevisionId: design.latestRevisionId, latestNumber: number, status,
    updatedAt: design.updatedAt.toISOString(), authorName: authorName ?? '', archived: design.archivedAt !== null,
    origin: design.origin ?? null,
  }))
}

export async function createDesign(caller: LabCaller, body: z.infer<typeof designCreate>) {
  const document = body.document === undefined ? starterDocument(body.name) : validDocument(body.document)
  const processId = body.processId ?? 'film-mask-soft-litho'
  const summary = summarizeRevision(document, processId)
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
