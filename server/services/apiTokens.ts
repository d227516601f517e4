// Personal API tokens for scripts (docs/api-tokens.md). A token is 32 random bytes (base64url) after "dwt_";
// PostgreSQL keeps its SHA-256 only, so it is shown once, when it is made. It works in one lab with one role whose
// permissions are all the person's own there — checked when it is made and again on every use against the
// person's current role (a token never outlives a demotion or a removal from the lab).
import { createHash, randomBytes } from 'node:crypto'
import { and, count, desc, eq, isNull, sql } from 'drizzle-orm'
import { createError } from 'h3'
import { apiTokens, labs, memberships, users } from '../db/schema'
import { useDb } from '../utils/db'
import { roleWithin, tokenRolesFor, TOKENS_PER_PERSON, type TokenCreate } from '#shared/schemas/tokens'
import type { ApiTokenInfo, NewApiToken } from '#shared/types/tokens'
import type { SessionData } from '#shared/types/session'
import { ROLE_LABELS } from '#shared/utils/roles'

export const TOKEN_PREFIX = 'dwt_'
const TOKEN_SHAPE = /^dwt_[A-Za-z0-9_-]{43}$/

const digest = (token: string) => createHash('sha256').update(token).digest('hex')

const infoColumns = {
  id: apiTokens.id,
  name: apiTokens.name,
  labId: apiTokens.labId,
  labName: labs.name,
  role: apiTokens.role,
  prefix: apiTokens.prefix,
  createdAt: apiTokens.createdAt,
  lastUsedAt: apiTokens.lastUsedAt,
  revokedAt: apiTokens.revokedAt,
}
type InfoRow = { createdAt: Date; lastUsedAt: Date | null; revokedAt: Date | null } & Omit<
  ApiTokenInfo,
  'createdAt' | 'lastUsedAt' | 'revokedAt'
>
const toInfo = (r: InfoRow): ApiTokenInfo => ({
  ...r,
  createdAt: r.createdAt.toISOString(),
  lastUsedAt: r.lastUsedAt?.toISOString() ?? null,
  revokedAt: r.revokedAt?.toISOString() ?? null,
})

export async function listTokens(session: SessionData): Promise<ApiTokenInfo[]> {
  const rows = await useDb()
    .select(infoColumns)
    .from(apiTokens)
    .innerJoin(labs, eq(labs.id, apiTokens.labId))
    .where(eq(apiTokens.userId, session.user.id))
    .orderBy(desc(apiTokens.createdAt))
  return rows.map(toInfo)
}

export async function createToken(session: SessionData, body: TokenCreate): Promise<NewApiToken> {
  const lab = session.memberships.find(m => m.labId === body.labId)
  if (!lab) throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such lab' })
  if (!roleWithin(body.role, lab.role)) {
    const allowed = tokenRolesFor(lab.role)
      .map(r => ROLE_LABELS[r])
      .join(', ')
    throw createError({
      statusCode: 400,
      statusMessage: 'Bad Request',
      message: `Body is invalid: role: a token may do only what you may do in ${lab.name} (you are ${ROLE_LABELS[lab.role]}): choose ${allowed}`,
      data: { issues: [{ path: 'role', message: `Choose ${allowed}` }] },
    })
  }
  const token = `${TOKEN_PREFIX}${randomBytes(32).toString('base64url')}`
  const db = useDb()
  return db.transaction(async tx => {
    // One person's tokens are counted under a lock on their own row, so parallel requests cannot pass the limit.
    await tx.select({ id: users.id }).from(users).where(eq(users.id, session.user.id)).for('no key update')
    const [open] = await tx
      .select({ n: count() })
      .from(apiTokens)
      .where(and(eq(apiTokens.userId, session.user.id), isNull(apiTokens.revokedAt)))
    if ((open?.n ?? 0) >= TOKENS_PER_PERSON) {
      throw createError({
        statusCode: 409,
        statusMessage: 'Conflict',
        message: `You have ${TOKENS_PER_PERSON} tokens, the most one person may have: revoke one you no longer use first`,
      })
    }
    const [row] = await tx
      .insert(apiTokens)
      .values({
        userId: session.user.id,
        labId: lab.labId,
        role: body.role,
        name: body.name,
        tokenHash: digest(token),
        prefix: token.slice(0, 10),
      })
      .returning({ id: apiTokens.id, createdAt: apiTokens.createdAt, prefix: apiTokens.prefix })
    return {
      token,
      id: row!.id,
      name: body.name,
      labId: lab.labId,
      labName: lab.name,
      role: body.role,
      prefix: row!.prefix,
      createdAt: row!.createdAt.toISOString(),
      lastUsedAt: null,
      revokedAt: null,
    }
  })
}

export async function revokeToken(session: SessionData, tokenId: string): Promise<ApiTokenInfo> {
  const db = useDb()
  await db
    .update(apiTokens)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, session.user.id), isNull(apiTokens.revokedAt)))
  const [row] = await db
    .select(infoColumns)
    .from(apiTokens)
    .innerJoin(labs, eq(labs.id, apiTokens.labId))
    .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, session.user.id)))
  if (!row) throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such token' })
  return toInfo(row)
}

/**
 * The caller a Bearer token stands for: the person, with only the token's lab and the token's role in it — so
 * `requireLabPermission` applies the token's scope. Null for a made-up, revoked or no longer fitting token.
 */
export async function resolveToken(token: string): Promise<SessionData | null> {
  if (!TOKEN_SHAPE.test(token)) return null
  const db = useDb()
  const [row] = await db
    .select({
      id: apiTokens.id,
      userId: users.id,
      email: users.email,
      name: users.name,
      tokenRole: apiTokens.role,
      lastUsedAt: apiTokens.lastUsedAt,
      labId: labs.id,
      slug: labs.slug,
      labName: labs.name,
      kind: labs.kind,
      memberRole: memberships.role,
    })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .innerJoin(labs, eq(labs.id, apiTokens.labId))
    .innerJoin(memberships, and(eq(memberships.userId, apiTokens.userId), eq(memberships.labId, apiTokens.labId)))
    .where(and(eq(apiTokens.tokenHash, digest(token)), isNull(apiTokens.revokedAt)))
  if (!row || !roleWithin(row.tokenRole, row.memberRole)) return null
  // When it was last used, to the minute (the account page shows it), without a write on every request.
  if (!row.lastUsedAt || Date.now() - row.lastUsedAt.getTime() > 60_000) {
    void db
      .update(apiTokens)
      .set({ lastUsedAt: sql`now()` })
      .where(eq(apiTokens.id, row.id))
      .catch(() => {})
  }
  return {
    user: { id: row.userId, email: row.email, name: row.name },
    memberships: [{ labId: row.labId, slug: row.slug, name: row.labName, kind: row.kind, role: row.tokenRole }],
  }
}
