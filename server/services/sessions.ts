// Server-side sessions in PostgreSQL: sign-out and expiry end them for every server instance.
import { createHash, randomBytes } from 'node:crypto'
import { and, eq, gt, lt } from 'drizzle-orm'
import { memberships, labs, sessions, users } from '../db/schema'
import { useDb } from '../utils/db'
import type { SessionData } from '../../shared/types/session'

const TTL_MS = Number(process.env.DW_SESSION_TTL_HOURS ?? 24 * 7) * 3600_000

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

export async function resolveSession(token: string): Promise<SessionData | null> {
  const db = useDb()
  const [row] = await db.select({ id: users.id, email: users.email, name: users.name })
    .from(sessions).innerJoin(users, eq(users.id, sessions.userId))
    .where(and(eq(sessions.tokenHash, digest(token)), gt(sessions.expiresAt, new Date())))
  if (!row) return null
  const labsOfUser = await db.select({ labId: labs.id, slug: labs.slug, name: labs.name, kind: labs.kind, role: memberships.role })
    .from(memberships).innerJoin(labs, eq(labs.id, memberships.labId))
    .where(eq(memberships.userId, row.id)).orderBy(memberships.createdAt, labs.name)
  return { user: row, memberships: labsOfUser }
}
