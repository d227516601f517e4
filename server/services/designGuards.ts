// Looking up a design or revision always goes through the caller's lab: another lab's id is simply not found.
import { and, eq } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, revisions } from '../db/schema'
import type { Db } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { can } from '../../shared/utils/roles'

export const notFound = (what: string) => createError({ statusCode: 404, statusMessage: 'Not Found', message: `No such ${what} in this lab` })

export async function findDesign(db: Db, caller: LabCaller, designId: string) {
  const [design] = await db.select().from(designs).where(and(eq(designs.id, designId), eq(designs.labId, caller.lab.labId)))
  if (!design) throw notFound('design')
  return design
}

/** A revision the caller may open: the lab's designs for most roles; only released ones for a fabricator. */
/** A revision's light columns: everything but the document and summary, which are large. */
export const revisionHead = {
  id: revisions.id, designId: revisions.designId, labId: revisions.labId, number: revisions.number, parentId: revisions.parentId,
  authorId: revisions.authorId, message: revisions.message, status: revisions.status, statusChangedAt: revisions.statusChangedAt,
  statusChangedBy: revisions.statusChangedBy, createdAt: revisions.createdAt,
}
export type RevisionHead = { [K in keyof typeof revisionHead]: (typeof revisions.$inferSelect)[K] }

export async function findVisibleRevision(db: Db, caller: LabCaller, revisionId: string): Promise<RevisionHead> {
  const [revision] = await db.select(revisionHead).from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.labId, caller.lab.labId)))
  if (!revision) throw notFound('revision')
  if (!can(caller.lab.role, 'designs:view') && revision.status !== 'released') throw notFound('revision')
  return revision
}
