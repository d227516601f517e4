// The revision read path, built as a JSON string: a revision's document and (finished) summary never change, so their JSON
// text is kept in a small in-memory cache and never parsed on the way out. Status and names are read fresh, in one
// prepared query. A fabricator's answer names no unreleased revision (`seenRevisionId`).
import { and, eq, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { LRUCache } from 'lru-cache'
import { designs, revisions, users } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { mayOpenRevision, notFound, seenRevisionId } from './designGuards'

// The least recently used revisions leave first (DW_REVISION_CACHE entries).
const content = new LRUCache<string, { document: string; summary: string }>({ max: useConfig().geometry.revisionCache })

async function contentOf(revisionId: string) {
  const hit = content.get(revisionId)
  if (hit) return hit
  const [row] = await useDb()
    .select({
      document: sql<string>`${revisions.document}::text`,
      summary: sql<string>`${revisions.summary}::text`,
      pending: sql<boolean>`${revisions.summary} ? 'pending'`,
    })
    .from(revisions)
    .where(eq(revisions.id, revisionId))
  const { pending, ...kept } = row!
  // A pending summary (a large chip's, being computed by the summary job) changes once: not kept until it is final.
  if (!pending) content.set(revisionId, kept)
  return kept
}

// Status and names, read fresh on every request: one named prepared statement.
const parent = alias(revisions, 'parent')
const latest = alias(revisions, 'latest')
let headQuery: ReturnType<typeof prepareHead> | undefined
function prepareHead() {
  return useDb()
    .select({
      id: revisions.id,
      designId: revisions.designId,
      number: revisions.number,
      parentId: revisions.parentId,
      message: revisions.message,
      createdAt: revisions.createdAt,
      status: revisions.status,
      statusChangedAt: revisions.statusChangedAt,
      authorName: users.name,
      designName: designs.name,
      latestRevisionId: designs.latestRevisionId,
      parentStatus: parent.status,
      latestStatus: latest.status,
    })
    .from(revisions)
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .innerJoin(users, eq(users.id, revisions.authorId))
    .leftJoin(parent, eq(parent.id, revisions.parentId))
    .leftJoin(latest, eq(latest.id, designs.latestRevisionId))
    .where(and(eq(revisions.id, sql.placeholder('revisionId')), eq(revisions.labId, sql.placeholder('labId'))))
    .prepare('dw_revision_head')
}

export async function revisionJson(caller: LabCaller, revisionId: string): Promise<string> {
  const [head] = await (headQuery ??= prepareHead()).execute({ revisionId, labId: caller.lab.labId })
  if (!head || !mayOpenRevision(caller, head.status)) throw notFound('revision')
  const { document, summary } = await contentOf(head.id)
  const fields = {
    id: head.id,
    designId: head.designId,
    number: head.number,
    parentId: seenRevisionId(caller, head.parentId, head.parentStatus),
    message: head.message,
    authorName: head.authorName,
    createdAt: head.createdAt.toISOString(),
    status: head.status,
    statusChangedAt: head.statusChangedAt.toISOString(),
    designName: head.designName,
    labId: caller.lab.labId,
    latestRevisionId: seenRevisionId(caller, head.latestRevisionId, head.latestStatus),
  }
  return `${JSON.stringify(fields).slice(0, -1)},"summary":${summary},"document":${document}}`
}
