// Demo fabrication orders: each demo release gets its order (in fabrication) with a short thread between the lab
// and the invented fabrication partner. Idempotent: a release that has its order is left alone.
import { and, eq, isNull } from 'drizzle-orm'
import type { Db } from '../utils/db'
import { fabOrderMessages, fabOrders, releases } from './schema'

export async function seedDemoOrders(db: Db, labId: string, people: { admin: string; fabricator: string }) {
  const open = await db
    .select({ id: releases.id, revisionId: releases.revisionId, releasedAt: releases.releasedAt })
    .from(releases)
    .leftJoin(fabOrders, eq(fabOrders.releaseId, releases.id))
    .where(and(eq(releases.labId, labId), isNull(fabOrders.id)))
  const taken = await db.select({ number: fabOrders.number }).from(fabOrders).where(eq(fabOrders.labId, labId))
  let number = Math.max(0, ...taken.map(t => t.number))
  for (const release of open) {
    // The order's story follows its release (work started a day later, a reply two hours after that) but never
    // after the seed runs: the demo's release is seeded "now", and a date in the future ("since 4 Dec" read on 3 Dec)
    // looked like a bug.
    const now = Date.now()
    const released = release.releasedAt.getTime()
    const started = new Date(Math.max(released, Math.min(released + 26 * 3600_000, now - 60_000)))
    const replied = new Date(Math.min(started.getTime() + 2 * 3600_000, now))
    const [order] = await db
      .insert(fabOrders)
      .values({
        labId,
        revisionId: release.revisionId,
        releaseId: release.id,
        number: ++number,
        status: 'in-fabrication',
        statusAt: started,
        quantity: 6,
        substrate: 'pdms-on-glass',
        maskPolarity: 'positive',
        maskMedium: 'film',
        dueDate: null,
        poNumber: 'QM-PO-0417',
        notes: 'Two wafers, 25 µm SU-8. Punch the ports at 0.75 mm.',
        createdBy: people.admin,
        createdAt: release.releasedAt,
      })
      .returning({ id: fabOrders.id })
    await db.insert(fabOrderMessages).values([
      {
        orderId: order!.id,
        labId,
        authorId: people.fabricator,
        body: 'Masks printed; spinning the first wafer tomorrow morning.',
        status: 'in-fabrication',
        createdAt: started,
      },
      {
        orderId: order!.id,
        labId,
        authorId: people.admin,
        body: 'Thanks. Could you send a profilometer trace of the junction area with the chips?',
        status: null,
        createdAt: replied,
      },
    ])
  }
  return open.length
}
