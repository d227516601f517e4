// Release to fabrication: an approved revision becomes visible to the lab's fabrication partner, with an order
// (server/services/orders.ts) saying what to make. A release cannot be undone.
import { desc, eq } from 'drizzle-orm'
import { designs, fabOrders, releases, revisions } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { logActivity } from './activity'
import { archivedDesign } from './designGuards'
import { conflict, lockRevision } from './locks'
import type { OrderDetails } from '#shared/schemas/orders'
import { createOrder } from './orders'
import { notifyReleased } from './notifications'

export async function releaseRevision(caller: LabCaller, revisionId: string, note: string, details: OrderDetails) {
  return useDb().transaction(async tx => {
    // Under the revision row lock a verdict racing this release has either committed (and is seen here) or waits.
    const revision = await lockRevision(tx, caller, revisionId)
    if (revision.archived) throw archivedDesign()
    if (revision.status === 'released')
      throw conflict('This revision has already been released to fabrication', { status: 'released' })
    if (revision.status !== 'approved') {
      throw conflict(`Only an approved revision can be released (this one is ${revision.status})`, {
        status: revision.status,
      })
    }
    await tx
      .update(revisions)
      .set({ status: 'released', statusChangedAt: new Date(), statusChangedBy: caller.userId })
      .where(eq(revisions.id, revisionId))
    const [release] = await tx
      .insert(releases)
      .values({ revisionId, labId: caller.lab.labId, releasedBy: caller.userId, note })
      .returning({ id: releases.id })
    const order = await createOrder(tx, caller, { revisionId, releaseId: release!.id, details })
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: revision.designId,
      revisionId,
      actorId: caller.userId,
      action: 'revision.released',
      detail: { note, order: order.number },
    })
    await notifyReleased(tx, caller, revision)
    return { status: 'released' as const, orderId: order.id, orderNumber: order.number }
  })
}

/** Released revisions with their order's status (the fab's view of the lab's work). */
export async function listReleased(caller: LabCaller) {
  const rows = await useDb()
    .select({
      revisionId: revisions.id,
      number: revisions.number,
      designName: designs.name,
      releasedAt: releases.releasedAt,
      orderId: fabOrders.id,
      orderNumber: fabOrders.number,
      orderStatus: fabOrders.status,
      orderStatusAt: fabOrders.statusAt,
      summary: revisions.summary,
    })
    .from(releases)
    .innerJoin(revisions, eq(revisions.id, releases.revisionId))
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .innerJoin(fabOrders, eq(fabOrders.releaseId, releases.id))
    .where(eq(releases.labId, caller.lab.labId))
    .orderBy(desc(releases.releasedAt))
  return rows.map(r => ({ ...r, releasedAt: r.releasedAt.toISOString(), orderStatusAt: r.orderStatusAt.toISOString() }))
}
