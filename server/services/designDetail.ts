import { eq } from 'drizzle-orm'
import { users } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { listActivity } from './activity'
import { findDesign } from './designGuards'
import { listRevisions } from './revisions'

export async function getDesignDetail(caller: LabCaller, designId: string) {
  const db = useDb()
  const design = await findDesign(db, caller, designId)
  const [creator] = await db.select({ name: users.name }).from(users).where(eq(users.id, design.createdBy))
  return {
    design: {
      id: design.id,
      name: design.name,
      description: design.description,
      processId: design.processId,
      createdBy: creator?.name ?? '',
      createdById: design.createdBy,
      createdAt: design.createdAt.toISOString(),
      updatedAt: design.updatedAt.toISOString(),
      archived: design.archivedAt !== null,
      latestRevisionId: design.latestRevisionId,
      origin: design.origin ?? null,
    },
    revisions: await listRevisions(caller, designId),
    activity: await listActivity(db, designId),
  }
}
