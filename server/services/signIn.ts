// Sign-in: one generic message for any wrong e-mail or password, and limits that cannot be raced nor turned into a
// lock-out (DEVELOPERS.md, "Access rules"):
// - every attempt reserves its row in `sign_in_failures` under a per-key advisory lock BEFORE the password hash is
//   checked, so N concurrent attempts check at most the limit; a right password gives the row back;
// - attempts from a browser that signed in to the account before (a known device) count only against that
//   device's own limit; all others count per account and per client address;
// - the counts live in PostgreSQL, so every server instance sees them.
import { and, eq, gt, isNull, sql } from 'drizzle-orm'
import { createError } from 'h3'
import { signInFailures, users } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb, type Tx } from '../utils/db'
import { verifyPassword } from '../utils/password'
import type { SignInBody } from '#shared/schemas/auth'
import { counted } from '#shared/utils/counted'
import { knownDevice } from './knownDevices'

const WINDOW_MIN = 15
const WINDOW = sql.raw(`interval '${WINDOW_MIN} minutes'`)
/** Unknown devices, per account. */
const MAX_PER_EMAIL = useConfig().signIn.maxPerEmail
/** Unknown devices, per client address (clientAddress: X-Forwarded-For only from DW_TRUSTED_PROXIES). */
const MAX_PER_IP = useConfig().signIn.maxPerIp
/** Each known device, on its own. */
const MAX_PER_DEVICE = useConfig().signIn.maxPerDevice

export const WRONG_CREDENTIALS = 'Wrong e-mail or password'

export interface SignInAttempt extends SignInBody {
  ip: string
  deviceToken?: string
}
export interface SignedIn {
  userId: string
  deviceId: string | null
}

function tooMany(retryAfterSeconds: number, why: 'account' | 'address' | 'device') {
  const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60))
  const hint =
    why === 'account'
      ? ' If this is your account, sign in from a browser you have signed in with before, or reset your password.'
      : ''
  return createError({
    statusCode: 429,
    statusMessage: 'Too Many Requests',
    message: `Too many failed sign-ins ${why === 'address' ? 'from this network' : 'for this account'}. Wait ${counted(minutes, 'minute', 'minutes')} and try again.${hint}`,
    data: { retryAfterSeconds },
  })
}

/** Failures (and attempts being checked) in the window matching `where`, and seconds until the oldest leaves it. */
async function inWindow(tx: Tx, where: ReturnType<typeof and>) {
  const [row] = await tx
    .select({
      n: sql<number>`count(*)::int`,
      retry: sql<number>`coalesce(ceil(extract(epoch from min(${signInFailures.at}) + ${WINDOW} - now())), 0)::int`,
    })
    .from(signInFailures)
    .where(and(where, gt(signInFailures.at, sql`now() - ${WINDOW}`)))
  // Clamped to the window: an attempt counted by a transaction that began after this one can read as 901 s.
  return { n: row?.n ?? 0, retry: Math.min(WINDOW_MIN * 60, Math.max(1, row?.retry ?? 0)) }
}

/** Serialises attempts on one key (an account, an address, a device) until the transaction ends. */
const lockKey = (tx: Tx, key: string) =>
  tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`sign-in:${key}`}, 0))`)

/**
 * Takes one attempt's place under the limits, or answers 429. The locks are always taken in the same order
 * (address, then account), so two attempts never wait on each other crosswise.
 */
async function reserveAttempt(email: string, ip: string, deviceId: string | null): Promise<void> {
  return useDb().transaction(async tx => {
    if (deviceId) {
      await lockKey(tx, `device:${deviceId}`)
      const device = await inWindow(tx, and(eq(signInFailures.deviceId, deviceId)))
      if (device.n >= MAX_PER_DEVICE) throw tooMany(device.retry, 'device')
    } else {
      await lockKey(tx, `ip:${ip}`)
      await lockKey(tx, `email:${email}`)
      const address = await inWindow(tx, and(eq(signInFailures.ip, ip), isNull(signInFailures.deviceId)))
      if (address.n >= MAX_PER_IP) throw tooMany(address.retry, 'address')
      const account = await inWindow(tx, and(eq(signInFailures.email, email), isNull(signInFailures.deviceId)))
      if (account.n >= MAX_PER_EMAIL) throw tooMany(account.retry, 'account')
    }
    await tx.insert(signInFailures).values({ email, ip, deviceId })
  })
}

/** The account's id when the password is right; 401 with one message for any wrong e-mail or password; 429 over a limit. */
export async function checkCredentials({ email, password, ip, deviceToken }: SignInAttempt): Promise<SignedIn> {
  const db = useDb()
  const [user] = await db
    .select({ id: users.id, hash: users.passwordHash })
    .from(users)
    .where(sql`lower(${users.email}) = ${email}`)
  const deviceId = await knownDevice(deviceToken, user?.id)
  await reserveAttempt(email, ip, deviceId)
  if (!(await verifyPassword(user?.hash ?? null, password))) {
    throw createError({ statusCode: 401, statusMessage: 'Unauthorized', message: WRONG_CREDENTIALS })
  }
  // Right: this attempt gives its place back, and so do this person's own earlier slips (same device, or same
  // address from an unknown device). Strangers' failures elsewhere keep counting.
  await db
    .delete(signInFailures)
    .where(
      deviceId
        ? eq(signInFailures.deviceId, deviceId)
        : and(eq(signInFailures.email, email), eq(signInFailures.ip, ip), isNull(signInFailures.deviceId)),
    )
  return { userId: user!.id, deviceId }
}
