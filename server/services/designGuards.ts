// Looking up a design or revision always goes through the caller's lab: another lab's id is simply not found.
// An archived design is read-only: every change on it (and its mask export) goes through `assertNotArchived`.
import { and, eq } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, revisions } from '../db/schema'
import type { Db, Tx } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { can } from '#shared/utils/roles'

export const notFound = (what: string) =>
  createError({ statusCode: 404, statusMessage: 'Not Found', message: `No such ${what} in this lab` })

export const archivedDesign = () =>
  createError({ statusCode: 409, statusMessage: 'Conflict', message: 'This design is archived: restore it first' })

/** 409 "restore it first" for a design (or a revision looked up with `findVisibleRevision`) that is archived. */
export function assertNotArchived(design: { archivedAt: Date | null }): void {
  if (design.archivedAt) throw archivedDesign()
}

/**
 * Inside a change's own transaction: holds the design against a concurrent archive (FOR SHARE, the first lock of
 * DEVELOPERS.md's order after the lab) and refuses an archived one.
 */
export async function holdOpenDesign(tx: Tx, designId: string): Promise<void> {
  const [design] = await tx
    .select({ archivedAt: designs.archivedAt })
    .from(designs)
    .where(eq(designs.id, designId))
    .for('share')
  if (!design) throw notFound('design')
  assertNotArchived(design)
}

/** The one visibility rule of revisions: the lab's designs for most roles; released ones only for a fabricator. */
export function mayOpenRevision(caller: LabCaller, status: string | null | undefined): boolean {
  return can(caller.lab.role, 'designs:view') || status === 'released'
}

/**
 * Another revision's id as the caller may see it: a fabricator only learns of released revisions, so the id of an
 * unreleased one (a parent, the design's latest) becomes null in their answers.
 */
export function seenRevisionId(caller: LabCaller, id: string | null, status: string | null | undefined): string | null {
  return id !== null && mayOpenRevision(caller, status) ? id : null
}

export async function findDesign(db: Db, caller: LabCaller, designId: string) {
  const [design] = await db
    .select()
    .from(designs)
    .where(and(eq(designs.id, designId), eq(designs.labId, caller.lab.labId)))
  if (!design) throw notFound('design')
  return design
}

/** A revision's light columns: everything but the document and summary, which are large. */
export const revisionHead = {
  id: revisions.id,
  designId: revisions.designId,
  labId: revisions.labId,
  number: revisions.number,
  parentId: revisions.parentId,
  authorId: revisions.authorId,
  message: revisions.message,
  status: revisions.status,
  statusChangedAt: revisions.statusChangedAt,
  statusChangedBy: revisions.statusChangedBy,
  createdAt: revisions.createdAt,
}
export type RevisionHead = { [K in keyof typeof revisionHead]: (typeof revisions.$inferSelect)[K] }

/**
 * A revision the caller may open: the lab's designs for most roles; only released ones for a fabricator.
 * With its design's `archivedAt`, for `assertNotArchived`.
 */
export async function findVisibleRevision(
  db: Db,
  caller: LabCaller,
  revisionId: string,
): Promise<RevisionHead & { archivedAt: Date | null }> {
  const [revision] = await db
    .select({ ...revisionHead, archivedAt: designs.archivedAt })
    .from(revisions)
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .where(and(eq(revisions.id, revisionId), eq(revisions.labId, caller.lab.labId)))
  if (!revision || !mayOpenRevision(caller, revision.status)) throw notFound('revision')
  return revision
}
