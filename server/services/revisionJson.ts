// The revision read path, built as a JSON string: a revision's document and summary never change, so their JSON
// text is kept in a small in-memory cache and never parsed on the way out. Status and names are read fresh, in one
// prepared query. A fabricator's answer names no unreleased revision (`seenRevisionId`).
import { eq, sql } from 'drizzle-orm'
import { revisions } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb, usePool } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { can } from '#shared/utils/roles'
import { notFound, seenRevisionId } from './designGuards'

const MAX_ENTRIES = useConfig().geometry.revisionCache
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

const HEAD_SQL = `
  select r.id, r.design_id, r.number, r.parent_id, r.message, r.created_at, r.status, r.status_changed_at,
         u.name as author_name, d.name as design_name, d.latest_revision_id, p.status as parent_status, l.status as latest_status
    from revisions r join designs d on d.id = r.design_id join users u on u.id = r.author_id
    left join revisions p on p.id = r.parent_id left join revisions l on l.id = d.latest_revision_id
   where r.id = $1 and r.lab_id = $2`

interface Head {
  id: string, design_id: string, number: number, parent_id: string | null, message: string, created_at: Date, status: string, status_changed_at: Date,
  author_name: string, design_name: string, latest_revision_id: string | null, parent_status: string | null, latest_status: string | null
}

export async function revisionJson(caller: LabCaller, revisionId: string): Promise<string> {
  const { rows: [head] } = await usePool().query<Head>({ name: 'dw-revision-head', text: HEAD_SQL, values: [revisionId, caller.lab.labId] })
  // Same rule as findVisibleRevision: a fabricator sees released revisions only.
  if (!head || (!can(caller.lab.role, 'designs:view') && head.status !== 'released')) throw notFound('revision')
  const { document, summary } = await contentOf(head.id)
  const fields = {
    id: head.id, designId: head.design_id, number: head.number, parentId: seenRevisionId(caller, head.parent_id, head.parent_status), message: head.message,
    authorName: head.author_name, createdAt: head.created_at.toISOString(), status: head.status,
    statusChangedAt: head.status_changed_at.toISOString(), designName: head.design_name, labId: caller.lab.labId,
    latestRevisionId: seenRevisionId(caller, head.latest_revision_id, head.latest_status),
  }
  return `${JSON.stringify(fields).slice(0, -1)},"summary":${summary},"document":${document}}`
}
