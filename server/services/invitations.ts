// Invitations by e-mail. The link carries a random token; the table keeps only its SHA-256. Lab-side queries are
// scoped to the caller's lab; the token-side ones find the invitation by the token's digest alone.
import { createHash, randomBytes } from 'node:crypto'
import { and, desc, eq, isNull, sql } from 'drizzle-orm'
import { createError } from 'h3'
import { invitations, labs, memberships, users, type Invitation } from '../db/schema'
import { useDb } from '../utils/db'
import { hashPassword, serverPasswordChecks } from '../utils/password'
import { parseOr400 } from '../utils/validate'
import type { LabCaller } from '../utils/access'
import {
  INVITATION_DAYS,
  newAccountFor,
  type InvitationAccept,
  type InvitationCreate,
  type NewAccount,
} from '#shared/schemas/invitations'
import type { InvitationInfo, PendingInvitation } from '#shared/types/invitations'
import type { SessionData } from '#shared/types/session'
import type { Role } from '#shared/utils/roles'
import { lockLab } from './locks'
import { queueMail } from './mail'
import { invitationMail } from './mailTemplates'

const digest = (token: string) => createHash('sha256').update(token).digest('hex')
const sameEmail = (column: typeof users.email | typeof invitations.email, email: string) =>
  sql`lower(${column}) = ${email.toLowerCase()}`

function view(row: Invitation, invitedByName: string): PendingInvitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    invitedByName,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    expired: row.expiresAt <= new Date(),
  }
}

export async function inviteToLab(
  caller: LabCaller,
  body: InvitationCreate,
  origin: string,
): Promise<PendingInvitation> {
  return useDb().transaction(async tx => {
    // One invitation change at a time per lab: the replace below then sees every link committed before it.
    await lockLab(tx, caller.lab.labId)
    const [member] = await tx
      .select({ id: users.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.labId, caller.lab.labId), sameEmail(users.email, body.email)))
    if (member) {
      throw createError({
        statusCode: 409,
        statusMessage: 'Conflict',
        message: `${body.email} is already a member of this lab: change their role in the list instead`,
        data: { issues: [{ path: 'email', message: 'Already a member of this lab' }] },
      })
    }
    // Inviting the same address again replaces the open invitation: only the newest link works.
    await tx
      .delete(invitations)
      .where(
        and(
          eq(invitations.labId, caller.lab.labId),
          sameEmail(invitations.email, body.email),
          isNull(invitations.acceptedAt),
        ),
      )
    const token = randomBytes(32).toString('base64url')
    const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000)
    const [row] = await tx
      .insert(invitations)
      .values({
        labId: caller.lab.labId,
        email: body.email,
        role: body.role,
        tokenHash: digest(token),
        invitedBy: caller.userId,
        expiresAt,
      })
      .returning()
    const [inviter] = await tx.select({ name: users.name }).from(users).where(eq(users.id, caller.userId))
    await queueMail(tx, {
      labId: caller.lab.labId,
      kind: 'invitation',
      to: body.email,
      ...invitationMail({
        labName: caller.lab.name,
        role: body.role,
        inviterName: inviter!.name,
        link: `${origin}/invitations/${token}`,
        expiresAt,
      }),
    })
    return view(row!, inviter!.name)
  })
}

export async function listInvitations(caller: LabCaller): Promise<PendingInvitation[]> {
  const rows = await useDb()
    .select({ invitation: invitations, invitedByName: users.name })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.labId, caller.lab.labId), isNull(invitations.acceptedAt)))
    .orderBy(desc(invitations.createdAt))
  return rows.map(r => view(r.invitation, r.invitedByName))
}

export async function revokeInvitation(caller: LabCaller, invitationId: string): Promise<void> {
  const gone = await useDb()
    .delete(invitations)
    .where(
      and(eq(invitations.labId, caller.lab.labId), eq(invitations.id, invitationId), isNull(invitations.acceptedAt)),
    )
    .returning({ id: invitations.id })
  if (!gone.length)
    throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such open invitation in this lab' })
}

// ── The link side: whoever holds the token ─────────────────────────────────────────────────────────────────

async function byToken(token: string) {
  const [row] = await useDb()
    .select({ invitation: invitations, labName: labs.name })
    .from(invitations)
    .innerJoin(labs, eq(labs.id, invitations.labId))
    .where(eq(invitations.tokenHash, digest(token)))
  if (!row)
    throw createError({
      statusCode: 404,
      statusMessage: 'Not Found',
      message: 'This invitation link is not valid. Ask a lab admin to invite you again.',
    })
  return row
}

function assertOpen(invitation: Invitation, labName: string) {
  if (invitation.acceptedAt) {
    throw createError({
      statusCode: 410,
      statusMessage: 'Gone',
      message: 'This invitation has already been used. Sign in to open the lab.',
    })
  }
  if (invitation.expiresAt <= new Date()) {
    throw createError({
      statusCode: 410,
      statusMessage: 'Gone',
      message: `This invitation expired on ${invitation.expiresAt.toISOString().slice(0, 10)}. Ask an admin of ${labName} to invite you again.`,
    })
  }
}

async function accountFor(email: string) {
  const [user] = await useDb().select({ id: users.id }).from(users).where(sameEmail(users.email, email))
  return user ?? null
}

export async function describeInvitation(token: string): Promise<InvitationInfo> {
  const { invitation, labName } = await byToken(token)
  if (invitation.acceptedAt) assertOpen(invitation, labName)
  return {
    labName,
    role: invitation.role,
    email: invitation.email,
    expiresAt: invitation.expiresAt.toISOString(),
    expired: invitation.expiresAt <= new Date(),
    hasAccount: !!(await accountFor(invitation.email)),
  }
}

const signInFirst = (email: string) =>
  createError({
    statusCode: 401,
    statusMessage: 'Unauthorized',
    message: `An account for ${email} already exists: sign in as ${email} first, then open this link again to accept.`,
    data: { signInRequired: true },
  })

const isUniqueViolation = (error: unknown) => {
  const e = error as { code?: string; cause?: { code?: string } }
  return e?.code === '23505' || e?.cause?.code === '23505'
}

export interface Acceptance {
  userId: string
  labId: string
  role: Role
  newAccount: boolean
}

/**
 * Signed in with the invited address: joins the lab. Not signed in and no account for the address: creates it from
 * `body` (name, password). An account that exists must sign in first. Used or expired links answer 410.
 */
export async function acceptInvitation(
  session: SessionData | null,
  token: string,
  body: InvitationAccept,
): Promise<Acceptance> {
  const { invitation, labName } = await byToken(token)
  assertOpen(invitation, labName)
  let passwordHash: string | null = null
  let account: NewAccount | null = null
  if (session) {
    if (session.user.email.toLowerCase() !== invitation.email.toLowerCase()) {
      throw createError({
        statusCode: 403,
        statusMessage: 'Forbidden',
        message: `This invitation is for ${invitation.email}, and you are signed in as ${session.user.email}. Sign out, then open the link again.`,
      })
    }
  } else {
    if (await accountFor(invitation.email)) throw signInFirst(invitation.email)
    account = parseOr400(newAccountFor(invitation.email, serverPasswordChecks), body, 'Body')
    passwordHash = await hashPassword(account.password) // slow on purpose: before the transaction, not inside it
  }
  return useDb().transaction(async tx => {
    // Two people opening the same link at once: the row lock lets exactly one of them through.
    const [locked] = await tx.select().from(invitations).where(eq(invitations.id, invitation.id)).for('update')
    if (!locked)
      throw createError({
        statusCode: 410,
        statusMessage: 'Gone',
        message: 'This invitation was withdrawn. Ask a lab admin to invite you again.',
      })
    assertOpen(locked, labName)
    let userId = session?.user.id
    if (!userId) {
      const created = await tx
        .insert(users)
        .values({ email: locked.email, name: account!.name, passwordHash: passwordHash! })
        .returning({ id: users.id })
        .catch(error => {
          throw isUniqueViolation(error) ? signInFirst(locked.email) : error
        })
      userId = created[0]!.id
    }
    await tx.insert(memberships).values({ userId, labId: locked.labId, role: locked.role }).onConflictDoNothing()
    await tx
      .update(invitations)
      .set({ acceptedAt: new Date(), acceptedBy: userId })
      .where(eq(invitations.id, locked.id))
    const [membership] = await tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.labId, locked.labId), eq(memberships.userId, userId)))
    return { userId, labId: locked.labId, role: membership!.role, newAccount: !session }
  })
}
