// Release to fabrication: an approved revision becomes visible to the lab's fabrication partner.
import { and, desc, eq } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, releases, revisions } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { logActivity } from './activity'
import { findVisibleRevision } from './designGuards'
import { notifyReleased } from './notifications'

export async function releaseRevision(caller: LabCaller, revisionId: string, note: string) {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  if (revision.status !== 'approved') {
    throw createError({ statusCode: 409, statusMessage: 'Conflict', message: `Only an approved revision can be released (this one is ${revision.status})` })
  }
  await db.transaction(async (tx) => {
    await tx.update(revisions).set({ status: 'released', statusChangedAt: new Date(), statusChangedBy: caller.userId }).where(eq(revisions.id, revisionId))
    await tx.insert(releases).values({ revisionId, labId: caller.lab.labId, releasedBy: caller.userId, note })
    await logActivity(tx, { labId: caller.lab.labId, designId: revision.designId, revisionId, actorId: caller.userId, action: 'revision.released', detail: { note } })
    await notifyReleased(tx, caller, revision)
  })
  return { status: 'released' as const }
}

export async function listReleased(caller: LabCaller) {
  const rows = await useDb().select({
    revisionId: revisions.id, number: revisions.number, designName: designs.name, releasedAt: releases.releasedAt,
    fabStatus: releases.fabStatus, fabStatusAt: releases.fabStatusAt, summary: revisions.summary,
  }).from(releases).innerJoin(revisions, eq(revisions.id, releases.revisionId)).innerJoin(designs, eq(designs.id, revisions.designId))
    .where(eq(releases.labId, caller.lab.labId)).orderBy(desc(releases.releasedAt))
  return rows.map(r => ({ ...r, releasedAt: r.releasedAt.toISOString(), fabStatusAt: r.fabStatusAt.toISOString() }))
}

export async function setFabStatus(caller: LabCaller, revisionId: string, fabStatus: typeof releases.$inferSelect.fabStatus, note: string) {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  const [row] = await db.update(releases).set({ fabStatus, fabStatusAt: new Date(), ...(note ? { note } : {}) })
    .where(and(eq(releases.revisionId, revisionId), eq(releases.labId, caller.lab.labId))).returning({ id: releases.id })
  if (!row) throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'This revision has not been released' })
  await logActivity(db, { labId: caller.lab.labId, designId: revision.designId, revisionId, actorId: caller.userId, action: 'fabrication.status', detail: { fabStatus, note } })
  return { fabStatus }
}
