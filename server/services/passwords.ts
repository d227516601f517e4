// Changing and resetting passwords, and signing out everywhere. A reset link carries a random token; the table keeps
// only its SHA-256; it works once, for PASSWORD_RESET_MINUTES. Every new password passes the shared policy
// (shared/schemas/auth.ts) with the server's common-password list.
import { createHash, randomBytes } from 'node:crypto'
import { and, count, eq, gt, isNull, sql } from 'drizzle-orm'
import { createError } from 'h3'
import { passwordResets, signInFailures, users } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb } from '../utils/db'
import { hashPassword, serverPasswordChecks } from '../utils/password'
import { parseOr400 } from '../utils/validate'
import type { SessionData } from '#shared/types/session'
import {
  PASSWORD_RESET_MINUTES,
  passwordResetBody,
  type PasswordChange,
  type PasswordResetBody,
  type PasswordResetRequest,
} from '#shared/schemas/auth'
import type { PasswordResetInfo } from '#shared/types/account'
import { queueMail } from './mail'
import { passwordResetMail } from './mailTemplates'
import { endSessionsOf } from './sessions'
import { checkCredentials } from './signIn'

const digest = (token: string) => createHash('sha256').update(token).digest('hex')
/** Reset mails one account gets in an hour at most: more requests are answered the same and send nothing. */
const RESETS_PER_HOUR = useConfig().signIn.resetsPerHour

/**
 * Signed in: checks the current password (it counts against the sign-in limits like any attempt), sets the new one
 * and ends every other session of the person; open reset links stop working.
 */
export async function changePassword(
  session: SessionData,
  keepToken: string,
  body: PasswordChange,
  attempt: { ip: string; deviceToken?: string },
): Promise<{ otherSessionsEnded: number }> {
  await checkCredentials({ email: session.user.email.toLowerCase(), password: body.currentPassword, ...attempt }).catch(
    error => {
      if (error?.statusCode !== 401) throw error
      throw createError({
        statusCode: 400,
        statusMessage: 'Bad Request',
        message: 'Your current password is not right: type it again',
        data: { issues: [{ path: 'currentPassword', message: 'Not your current password: type it again' }] },
      })
    },
  )
  const passwordHash = await hashPassword(body.newPassword) // slow on purpose: before the transaction, not inside it
  return useDb().transaction(async tx => {
    await tx.update(users).set({ passwordHash }).where(eq(users.id, session.user.id))
    await tx
      .update(passwordResets)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResets.userId, session.user.id), isNull(passwordResets.usedAt)))
    return { otherSessionsEnded: await endSessionsOf(tx, session.user.id, keepToken) }
  })
}

/** Ends every session of the person, this one included. */
export async function signOutEverywhere(userId: string): Promise<{ sessionsEnded: number }> {
  return { sessionsEnded: await endSessionsOf(useDb(), userId) }
}

/** The same answer whether or not an account has the address, so the form tells nobody who has one. */
export const RESET_REQUESTED =
  'If a Dropwright account uses that address, a link to choose a new password is on its way. Check your mail (and its spam folder).'

export async function requestPasswordReset(
  { email }: PasswordResetRequest,
  origin: string,
): Promise<{ message: string }> {
  await useDb().transaction(async tx => {
    const [user] = await tx
      .select({ id: users.id, email: users.email, name: users.name })
      .from(users)
      .where(sql`lower(${users.email}) = ${email}`)
      .for('no key update')
    if (!user) return
    const [recent] = await tx
      .select({ n: count() })
      .from(passwordResets)
      .where(and(eq(passwordResets.userId, user.id), gt(passwordResets.createdAt, sql`now() - interval '1 hour'`)))
    if ((recent?.n ?? 0) >= RESETS_PER_HOUR) return
    const token = randomBytes(32).toString('base64url')
    const expiresAt = new Date(Date.now() + PASSWORD_RESET_MINUTES * 60_000)
    await tx.insert(passwordResets).values({ userId: user.id, tokenHash: digest(token), expiresAt })
    await queueMail(tx, {
      kind: 'password-reset',
      to: user.email,
      ...passwordResetMail({
        name: user.name,
        link: `${origin}/reset-password/${token}`,
        minutes: PASSWORD_RESET_MINUTES,
      }),
    })
  })
  return { message: RESET_REQUESTED }
}

const invalidLink = () =>
  createError({
    statusCode: 404,
    statusMessage: 'Not Found',
    message: 'This reset link is not valid. Ask for a new one on the sign-in page ("Forgot your password?").',
  })

function assertOpen(reset: { usedAt: Date | null; expiresAt: Date }) {
  if (reset.usedAt)
    throw createError({
      statusCode: 410,
      statusMessage: 'Gone',
      message: 'This reset link has already been used. Sign in, or ask for a new link.',
    })
  if (reset.expiresAt <= new Date())
    throw createError({
      statusCode: 410,
      statusMessage: 'Gone',
      message: `This reset link expired (links work for ${PASSWORD_RESET_MINUTES} minutes). Ask for a new one.`,
    })
}

async function byToken(token: string) {
  const [row] = await useDb()
    .select({ reset: passwordResets, email: users.email, name: users.name })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(eq(passwordResets.tokenHash, digest(token)))
  if (!row) throw invalidLink()
  return row
}

/** What the reset page shows: whose password it sets (the link went to that address), until when it works. */
export async function describePasswordReset(token: string): Promise<PasswordResetInfo> {
  const { reset, email, name } = await byToken(token)
  assertOpen(reset)
  return { email, name, expiresAt: reset.expiresAt.toISOString() }
}

/**
 * Sets the password from a reset link: the link is used up, every session of the person ends, and the failed
 * sign-ins counted against the account are forgotten (its owner has just shown they read its mail).
 */
export async function resetPassword(
  token: string,
  body: PasswordResetBody,
): Promise<{ userId: string; sessionsEnded: number }> {
  const { reset, email, name } = await byToken(token)
  assertOpen(reset)
  const { password } = parseOr400(passwordResetBody({ email, name }, serverPasswordChecks), body, 'Body')
  const passwordHash = await hashPassword(password)
  return useDb().transaction(async tx => {
    // Two tabs submitting the same link: the row lock lets exactly one through.
    const [locked] = await tx.select().from(passwordResets).where(eq(passwordResets.id, reset.id)).for('update')
    if (!locked) throw invalidLink()
    assertOpen(locked)
    await tx.update(users).set({ passwordHash }).where(eq(users.id, locked.userId))
    await tx
      .update(passwordResets)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResets.userId, locked.userId), isNull(passwordResets.usedAt)))
    await tx
      .delete(signInFailures)
      .where(and(eq(signInFailures.email, email.toLowerCase()), isNull(signInFailures.deviceId)))
    return { userId: locked.userId, sessionsEnded: await endSessionsOf(tx, locked.userId) }
  })
}
