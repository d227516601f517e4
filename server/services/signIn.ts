// Sign-in: one generic message for any wrong e-mail or password; repeated failures throttled per e-mail and per
// address, counted in PostgreSQL so that every server instance sees them.
import { and, count, eq, gt, sql } from 'drizzle-orm'
import { createError } from 'h3'
import { signInFailures, users } from '../db/schema'
import { useDb } from '../utils/db'
import { verifyPassword } from '../utils/password'
import type { SignInBody } from '../../shared/schemas/auth'

const WINDOW_MS = 15 * 60_000
const MAX_PER_EMAIL = Number(process.env.DW_SIGNIN_MAX_PER_EMAIL ?? 5)
const MAX_PER_IP = Number(process.env.DW_SIGNIN_MAX_PER_IP ?? 50)
export const WRONG_CREDENTIALS = 'Wrong e-mail or password'

async function recentFailures(column: typeof signInFailures.email | typeof signInFailures.ip, value: string) {
  const since = new Date(Date.now() - WINDOW_MS)
  const [row] = await useDb().select({ n: count() }).from(signInFailures).where(and(eq(column, value), gt(signInFailures.at, since)))
  return row?.n ?? 0
}

export async function checkCredentials({ email, password }: SignInBody, ip: string): Promise<string> {
  if (await recentFailures(signInFailures.email, email) >= MAX_PER_EMAIL || await recentFailures(signInFailures.ip, ip) >= MAX_PER_IP) {
    throw createError({ statusCode: 429, statusMessage: 'Too Many Requests', message: 'Too many failed sign-ins. Wait 15 minutes and try again.' })
  }
  const db = useDb()
  const [user] = await db.select({ id: users.id, hash: users.passwordHash }).from(users).where(sql`lower(${users.email}) = ${email}`)
  if (!(await verifyPassword(user?.hash ?? null, password))) {
    await db.insert(signInFailures).values({ email, ip })
    throw createError({ statusCode: 401, statusMessage: 'Unauthorized', message: WRONG_CREDENTIALS })
  }
  await db.delete(signInFailures).where(eq(signInFailures.email, email))
  return user!.id
}
