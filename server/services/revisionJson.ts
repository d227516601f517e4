// The revision read path, built as a JSON string: a revision's document and summary never change, so their JSON
// text is kept in a small in-memory cache and never parsed on the way out. Status and names are read fresh.
import { eq, sql } from 'drizzle-orm'
import { designs, revisions, users } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { findVisibleRevision } from './designGuards'

const MAX_ENTRIES = Number(process.env.DW_REVISION_CACHE ?? 64)
const content = new Map<string, { document: string, summary: string }>()

async function contentOf(revisionId: string) {
  const hit = content.get(revisionId)
  if (hit) {
    content.delete(revisionId) // keep the most recently used last
    content.set(revisionId, hit)
    return hit
  }
  const [row] = await useDb().select({ document: sql<string>`${revisions.document}::text`, summary: sql<string>`${revisions.summary}::text` })
    .from(revisions).where(eq(revisions.id, revisionId))
  content.set(revisionId, row!)
  if (content.size > MAX_ENTRIES) content.delete(content.keys().next().value!)
  return row!
}

export async function revisionJson(caller: LabCaller, revisionId: string): Promise<string> {
  const db = useDb()
  const head = await findVisibleRevision(db, caller, revisionId)
  const [names] = await db.select({ authorName: users.name, designName: designs.name, latestRevisionId: designs.latestRevisionId })
    .from(designs).innerJoin(users, eq(users.id, head.authorId)).where(eq(designs.id, head.designId))
  const { document, summary } = await contentOf(head.id)
  const fields = {
    id: head.id, designId: head.designId, number: head.number, parentId: head.parentId, message: head.message,
    authorName: names!.authorName, createdAt: head.createdAt.toISOString(), status: head.status,
    statusChangedAt: head.statusChangedAt.toISOString(), designName: names!.designName, labId: caller.lab.labId, latestRevisionId: names!.latestRevisionId,
  }
  return `${JSON.stringify(fields).slice(0, -1)},"summary":${summary},"document":${document}}`
}
