// Release to fabrication: an approved revision becomes visible to the lab's fabrication partner.
import { and, desc, eq, inArray } from 'drizzle-orm'
import { createError } from 'h3'
import { designs, releases, revisions } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { logActivity } from './activity'
import { archivedDesign, findVisibleRevision } from './designGuards'
import { conflict, lockRevision } from './locks'
import { FAB_NEXT, FAB_STATUS_LABELS, fabFrom, type FabStatus } from '#shared/utils/fabStatus'
import { notifyReleased } from './notifications'

export async function releaseRevision(caller: LabCaller, revisionId: string, note: string) {
  await useDb().transaction(async (tx) => {
    // Under the revision row lock a verdict racing this release has either committed (and is seen here) or waits.
    const revision = await lockRevision(tx, caller, revisionId)
    if (revision.archived) throw archivedDesign()
    if (revision.status === 'released') throw conflict('This revision has already been released to fabrication', { status: 'released' })
    if (revision.status !== 'approved') {
      throw conflict(`Only an approved revision can be released (this one is ${revision.status})`, { status: revision.status })
    }
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

/** A guarded move: the update names the statuses it may come from, so of two racing moves only one applies. */
export async function setFabStatus(caller: LabCaller, revisionId: string, fabStatus: FabStatus, note: string) {
  const db = useDb()
  const revision = await findVisibleRevision(db, caller, revisionId)
  return db.transaction(async (tx) => {
    const [row] = await tx.update(releases).set({ fabStatus, fabStatusAt: new Date(), ...(note ? { note } : {}) })
      .where(and(eq(releases.revisionId, revisionId), eq(releases.labId, caller.lab.labId), inArray(releases.fabStatus, fabFrom(fabStatus))))
      .returning({ id: releases.id })
    if (!row) {
      const [current] = await tx.select({ fabStatus: releases.fabStatus }).from(releases)
        .where(and(eq(releases.revisionId, revisionId), eq(releases.labId, caller.lab.labId)))
      if (!current) throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'This revision has not been released' })
      const next = FAB_NEXT[current.fabStatus].map(s => FAB_STATUS_LABELS[s].toLowerCase())
      throw conflict(`The order is ${FAB_STATUS_LABELS[current.fabStatus].toLowerCase()}: it cannot move to ${FAB_STATUS_LABELS[fabStatus].toLowerCase()}${next.length ? ` (it can move to: ${next.join(', ')})` : ' (received is final)'}`, { fabStatus: current.fabStatus })
    }
    await logActivity(tx, { labId: caller.lab.labId, designId: revision.designId, revisionId, actorId: caller.userId, action: 'fabrication.status', detail: { fabStatus, note } })
    return { fabStatus }
  })
}
