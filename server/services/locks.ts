// Row locks for guarded state changes. Lock order, always (DEVELOPERS.md, "Database work"):
//   lab row → design row → revision row → release row,
// each taken inside the change's own transaction, on its one connection. A lost race then sees the winner's
// committed state and answers 409 with what happened. Exclusive locks are FOR NO KEY UPDATE, never FOR UPDATE:
// every insert that references the row (a revision's lab_id, an activity's design_id) takes FOR KEY SHARE on it,
// which FOR UPDATE blocks — a lab-wide FOR UPDATE deadlocked with saves that were checking their lab foreign key.
import { and, eq } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, labs, revisions } from '../db/schema'
import type { Tx } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { mayOpenRevision, notFound, revisionHead, type RevisionHead } from './designGuards'

export const conflict = (message: string, data?: Record<string, unknown>) =>
  createError({ statusCode: 409, statusMessage: 'Conflict', message, data })

/** The lab row, for changes to who is in the lab (roles, removals, invitations): one at a time per lab. */
export async function lockLab(tx: Tx, labId: string): Promise<void> {
  const [row] = await tx.select({ id: labs.id }).from(labs).where(eq(labs.id, labId)).for('no key update')
  if (!row) throw notFound('lab')
}

/**
 * A revision the caller may see, locked for a status change (verdict, release), with its design held against a
 * concurrent archive (FOR SHARE on the design, then FOR NO KEY UPDATE on the revision: the lock order above).
 */
export async function lockRevision(
  tx: Tx,
  caller: LabCaller,
  revisionId: string,
): Promise<RevisionHead & { archived: boolean }> {
  const [design] = await tx
    .select({ id: designs.id, archivedAt: designs.archivedAt })
    .from(designs)
    .innerJoin(revisions, eq(revisions.designId, designs.id))
    .where(and(eq(revisions.id, revisionId), eq(designs.labId, caller.lab.labId)))
    .for('share', { of: designs })
  if (!design) throw notFound('revision')
  const [revision] = await tx
    .select(revisionHead)
    .from(revisions)
    .where(eq(revisions.id, revisionId))
    .for('no key update')
  if (!revision || !mayOpenRevision(caller, revision.status)) throw notFound('revision')
  return { ...revision, archived: design.archivedAt !== null }
}
