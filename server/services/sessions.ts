// Server-side sessions in PostgreSQL: sign-out and expiry end them for every server instance.
import { createHash, randomBytes } from 'node:crypto'
import { and, eq, gt, lt, ne, sql } from 'drizzle-orm'
import { labs, memberships, sessions, users } from '../db/schema'
import { useDb } from '../utils/db'
import { useConfig } from '../utils/config'
import type { SessionData } from '#shared/types/session'
import type { DbOrTx } from './mail'

const TTL_MS = useConfig().session.ttlHours * 3600_000

const digest = (token: string) => createHash('sha256').update(token).digest('hex')

export async function createSession(userId: string): Promise<{ token: string; expiresAt: Date }> {
  const token = randomBytes(32).toString('base64url')
  const expiresAt = new Date(Date.now() + TTL_MS)
  const db = useDb()
  await db.insert(sessions).values({ tokenHash: digest(token), userId, expiresAt })
  await db.delete(sessions).where(lt(sessions.expiresAt, new Date()))
  return { token, expiresAt }
}

export async function endSession(token: string): Promise<void> {
  await useDb()
    .delete(sessions)
    .where(eq(sessions.tokenHash, digest(token)))
}

/**
 * Ends every session of `userId` (sign out everywhere, a password reset), or every one but the session of
 * `keepToken` (a password change keeps the browser that made it signed in). Returns how many ended.
 */
export async function endSessionsOf(db: DbOrTx, userId: string, keepToken?: string): Promise<number> {
  const rows = await db
    .delete(sessions)
    .where(
      keepToken
        ? and(eq(sessions.userId, userId), ne(sessions.tokenHash, digest(keepToken)))
        : eq(sessions.userId, userId),
    )
    .returning({ tokenHash: sessions.tokenHash })
  return rows.length
}

/** One round trip, a named prepared statement (planned once per connection): the live session's person and labs. */
let sessionQuery: ReturnType<typeof prepareSessionQuery> | undefined
function prepareSessionQuery() {
  return useDb()
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      labId: labs.id,
      slug: labs.slug,
      labName: labs.name,
      kind: labs.kind,
      role: memberships.role,
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .leftJoin(memberships, eq(memberships.userId, users.id))
    .leftJoin(labs, eq(labs.id, memberships.labId))
    .where(and(eq(sessions.tokenHash, sql.placeholder('tokenHash')), gt(sessions.expiresAt, sql`now()`)))
    .orderBy(memberships.createdAt, labs.name)
    .prepare('dw_session')
}

export async function resolveSession(token: string): Promise<SessionData | null> {
  const rows = await (sessionQuery ??= prepareSessionQuery()).execute({ tokenHash: digest(token) })
  const first = rows[0]
  if (!first) return null
  return {
    user: { id: first.id, email: first.email, name: first.name },
    memberships: rows.flatMap(r =>
      r.labId && r.role ? [{ labId: r.labId, slug: r.slug!, name: r.labName!, kind: r.kind!, role: r.role }] : [],
    ),
  }
}
