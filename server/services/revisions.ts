// Revisions are immutable: a save always inserts a new one. Optimistic concurrency: a save whose parent is no
// longer the design's latest revision gets 409 with what changed since, unless it asks to branch.
import { and, asc, eq } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { createError } from 'h3'
import { designs, revisions, users } from '../db/schema'
import { useDb, withClient } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { RevisionDetail, RevisionRow, RevisionSummary } from '#shared/types/designs'
import type { revisionCreate } from '#shared/schemas/designs'
import type { z } from 'zod'
import { archivedDesign, assertNotArchived, findDesign, findVisibleRevision, notFound, seenRevisionId } from './designGuards'
import { validDocument } from './documents'
import { summarizeWithLibrary } from './libraries'

const rowColumns = {
  id: revisions.id, designId: revisions.designId, number: revisions.number, parentId: revisions.parentId, message: revisions.message,
  authorName: users.name, createdAt: revisions.createdAt, status: revisions.status, statusChangedAt: revisions.statusChangedAt, summary: revisions.summary,
}

type RawRow = { createdAt: Date, statusChangedAt: Date, summary: unknown } & Omit<RevisionRow, 'createdAt' | 'statusChangedAt' | 'summary'>
const toRow = (r: RawRow): RevisionRow => ({ ...r, createdAt: r.createdAt.toISOString(), statusChangedAt: r.statusChangedAt.toISOString(), summary: r.summary as RevisionSummary })

export async function listRevisions(caller: LabCaller, designId: string): Promise<RevisionRow[]> {
  const db = useDb()
  await findDesign(db, caller, designId)
  const rows = await db.select(rowColumns).from(revisions).innerJoin(users, eq(users.id, revisions.authorId))
    .where(and(eq(revisions.designId, designId), eq(revisions.labId, caller.lab.labId))).orderBy(asc(revisions.number))
  return rows.map(toRow)
}

/** A revision with its document; `{ open: true }` (mask export) refuses one on an archived design. */
export async function getRevision(caller: LabCaller, revisionId: string, options: { open?: boolean } = {}): Promise<RevisionDetail> {
  const db = useDb()
  const visible = await findVisibleRevision(db, caller, revisionId)
  if (options.open) assertNotArchived(visible)
  const parent = alias(revisions, 'parent')
  const latest = alias(revisions, 'latest')
  const [row] = await db.select({ ...rowColumns, document: revisions.document, designName: designs.name, latestRevisionId: designs.latestRevisionId, parentStatus: parent.status, latestStatus: latest.status })
    .from(revisions).innerJoin(users, eq(users.id, revisions.authorId)).innerJoin(designs, eq(designs.id, revisions.designId))
    .leftJoin(parent, eq(parent.id, revisions.parentId)).leftJoin(latest, eq(latest.id, designs.latestRevisionId))
    .where(eq(revisions.id, visible.id))
  const { parentStatus, latestStatus, designName, document, latestRevisionId, ...rest } = row!
  return {
    ...toRow(rest), parentId: seenRevisionId(caller, rest.parentId, parentStatus), designName, labId: caller.lab.labId, document,
    latestRevisionId: seenRevisionId(caller, latestRevisionId, latestStatus),
  }
}

export async function createRevision(caller: LabCaller, designId: string, body: z.infer<typeof revisionCreate>) {
  const design = await findDesign(useDb(), caller, designId)
  assertNotArchived(design)
  const document = validDocument(body.document)
  // A parent that is already not the latest never becomes it again: such a save ends in 409 below, so it skips the
  // summary (the expensive part) and leaves the geometry workers to saves that can win.
  const stale = !body.branch && design.latestRevisionId !== body.parentId
  const summary = stale ? null : await summarizeWithLibrary(document, design.processId, caller.lab.labId)
  // One connection from begin to commit (DEVELOPERS.md, "Database work"): the loser of a race reads what came
  // after its parent on the connection that holds the lock, never through a second checkout.
  return withClient(async (client) => {
    // Lock the design row: concurrent saves on one design queue here, and the parent check below sees the truth.
    const { rows: [locked] } = await client.query<{ latest: string | null, count: number, parent: number | null, archived: boolean }>({
      name: 'dw-save-lock', text: LOCK_SQL, values: [designId, body.parentId],
    })
    if (!locked) throw notFound('design')
    if (locked.archived) throw archivedDesign()
    if (locked.parent === null) throw notFound('parent revision for this design')
    if (!body.branch && locked.latest !== body.parentId) {
      const { rows } = await client.query<RawRow>({ name: 'dw-save-since', text: SINCE_SQL, values: [designId, locked.parent] })
      const since = rows.map(toRow)
      throw createError({
        statusCode: 409, statusMessage: 'Conflict',
        message: `Revision ${locked.parent} is no longer the latest: ${since.map(r => `r${r.number} by ${r.authorName} ("${r.message}")`).join(', ')} came after it. Reload, or save yours as a branch.`,
        data: { latestRevisionId: locked.latest, since },
      })
    }
    if (!summary) throw new Error('a save without a summary reached the insert') // unreachable: stale saves end in 409 above
    const number = locked.count + 1
    const action = body.branch ? 'revision.branched' : 'revision.saved'
    const { rows: [revision] } = await client.query<{ id: string }>({
      name: 'dw-save-insert', text: INSERT_SQL,
      values: [designId, caller.lab.labId, number, body.parentId, caller.userId, body.message, JSON.stringify(document), JSON.stringify(summary),
        summary.junctionKinds, action, JSON.stringify({ number, parent: locked.parent, message: body.message })],
    })
    return { revisionId: revision!.id, number }
  })
}

// One round trip each (the save is the busiest write): lock + parent check, then revision + design + activity.
const LOCK_SQL = `
  select d.latest_revision_id as latest, d.revision_count as count, d.archived_at is not null as archived,
         (select p.number from revisions p where p.id = $2 and p.design_id = d.id) as parent
    from designs d where d.id = $1 for no key update`
const SINCE_SQL = `
  select r.id, r.design_id as "designId", r.number, r.parent_id as "parentId", r.message, u.name as "authorName",
         r.created_at as "createdAt", r.status, r.status_changed_at as "statusChangedAt", r.summary
    from revisions r join users u on u.id = r.author_id
   where r.design_id = $1 and r.number > $2 order by r.number`
const INSERT_SQL = `
  with rev as (
    insert into revisions (design_id, lab_id, number, parent_id, author_id, message, document, summary)
    values ($1, $2, $3, $4, $5, $6, $7::jsonb, $8::jsonb) returning id),
  upd as (
    update designs set latest_revision_id = (select id from rev), revision_count = $3, updated_at = now(), junction_kinds = $9
     where id = $1),
  act as (
    insert into activity (lab_id, design_id, revision_id, actor_id, action, detail)
    select $2, $1, id, $5, $10, $11::jsonb from rev)
  select id from rev`
