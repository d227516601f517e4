// Server-side sessions in PostgreSQL: sign-out and expiry end them for every server instance.
import { createHash, randomBytes } from 'node:crypto'
import { and, eq, lt, ne } from 'drizzle-orm'
import { sessions } from '../db/schema'
import { useDb, usePool } from '../utils/db'
import { useConfig } from '../utils/config'
import type { SessionData } from '#shared/types/session'
import type { DbOrTx } from './mail'

const TTL_MS = useConfig().session.ttlHours * 3600_000

const digest = (token: string) => createHash('sha256').update(token).digest('hex')

export async function createSession(userId: string): Promise<{ token: string, expiresAt: Date }> {
  const token = randomBytes(32).toString('base64url')
  const expiresAt = new Date(Date.now() + TTL_MS)
  const db = useDb()
  await db.insert(sessions).values({ tokenHash: digest(token), userId, expiresAt })
  await db.delete(sessions).where(lt(sessions.expiresAt, new Date()))
  return { token, expiresAt }
}

export async function endSession(token: string): Promise<void> {
  await useDb().delete(sessions).where(eq(sessions.tokenHash, digest(token)))
}

/**
 * Ends every session of `userId` (sign out everywhere, a password reset), or every one but the session of
 * `keepToken` (a password change keeps the browser that made it signed in). Returns how many ended.
 */
export async function endSessionsOf(db: DbOrTx, userId: string, keepToken?: string): Promise<number> {
  const rows = await db.delete(sessions)
    .where(keepToken ? and(eq(sessions.userId, userId), ne(sessions.tokenHash, digest(keepToken))) : eq(sessions.userId, userId))
    .returning({ tokenHash: sessions.tokenHash })
  return rows.length
}

/** One round trip, prepared once per connection: the live session's person and all their labs. */
const SESSION_QUERY = `
  select u.id, u.email, u.name,
         coalesce(json_agg(json_build_object('labId', l.id, 'slug', l.slug, 'name', l.name, 'kind', l.kind, 'role', m.role)
                           order by m.created_at, l.name) filter (where l.id is not null), '[]') as memberships
    from sessions s join users u on u.id = s.user_id
    left join memberships m on m.user_id = u.id left join labs l on l.id = m.lab_id
   where s.token_hash = $1 and s.expires_at > now()
   group by u.id`

export async function resolveSession(token: string): Promise<SessionData | null> {
  const { rows } = await usePool().query<{ id: string, email: string, name: string, memberships: SessionData['memberships'] }>({ name: 'dw-session', text: SESSION_QUERY, values: [digest(token)] })
  const row = rows[0]
  return row ? { user: { id: row.id, email: row.email, name: row.name }, memberships: row.memberships } : null
}
