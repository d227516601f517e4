// Known devices: a browser that signed in to an account gets a `dw_device` cookie (a random token; the table keeps
// its SHA-256, bound to that account). Its later sign-in attempts to the same account are counted apart from
// everyone else's, so strangers failing at the account cannot keep its owner out (server/services/signIn.ts).
import { createHash, randomBytes } from 'node:crypto'
import { and, eq, gt, lt, sql } from 'drizzle-orm'
import { knownDevices } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb } from '../utils/db'

export const DEVICE_DAYS = useConfig().session.deviceDays
const digest = (token: string) => createHash('sha256').update(token).digest('hex')

/** The live device behind `token` when it belongs to `userId`; anyone else's token counts as an unknown device. */
export async function knownDevice(token: string | undefined, userId: string | undefined): Promise<string | null> {
  if (!token || !userId || !/^[A-Za-z0-9_-]{43}$/.test(token)) return null
  const [row] = await useDb()
    .select({ id: knownDevices.id })
    .from(knownDevices)
    .where(
      and(
        eq(knownDevices.tokenHash, digest(token)),
        eq(knownDevices.userId, userId),
        gt(knownDevices.expiresAt, sql`now()`),
      ),
    )
  return row?.id ?? null
}

/**
 * After a successful sign-in: keeps the device (its expiry moves on) or registers a new one. Returns the token to
 * set in the cookie, or null when the cookie already holds the right one.
 */
export async function rememberDevice(
  userId: string,
  deviceId: string | null,
): Promise<{ token: string | null; expiresAt: Date }> {
  const expiresAt = new Date(Date.now() + DEVICE_DAYS * 86_400_000)
  const db = useDb()
  if (deviceId) {
    await db.update(knownDevices).set({ lastUsedAt: new Date(), expiresAt }).where(eq(knownDevices.id, deviceId))
    return { token: null, expiresAt }
  }
  const token = randomBytes(32).toString('base64url')
  await db.insert(knownDevices).values({ userId, tokenHash: digest(token), expiresAt })
  await db.delete(knownDevices).where(lt(knownDevices.expiresAt, new Date()))
  return { token, expiresAt }
}
