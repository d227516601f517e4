// The audit trail: one row per thing that happened to a design, written in the same transaction.
import { desc, eq } from 'drizzle-orm'
import { activity, revisions, users } from '../db/schema'
import type { Db, Tx } from '../utils/db'
import type { ActivityEntry } from '#shared/types/designs'

export async function logActivity(
  db: Db | Tx,
  entry: {
    labId: string
    designId: string
    revisionId?: string | null
    actorId: string
    action: string
    detail?: Record<string, unknown>
  },
) {
  await db.insert(activity).values({ ...entry, detail: entry.detail ?? {} })
}

export async function listActivity(db: Db, designId: string, limit = 200): Promise<ActivityEntry[]> {
  const rows = await db
    .select({
      id: activity.id,
      action: activity.action,
      actorName: users.name,
      at: activity.at,
      revisionNumber: revisions.number,
      detail: activity.detail,
    })
    .from(activity)
    .innerJoin(users, eq(users.id, activity.actorId))
    .leftJoin(revisions, eq(revisions.id, activity.revisionId))
    .where(eq(activity.designId, designId))
    .orderBy(desc(activity.at), desc(activity.id))
    .limit(limit)
  return rows.map(r => ({ ...r, at: r.at.toISOString() }))
}
