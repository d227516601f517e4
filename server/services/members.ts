// A lab's members. Every query is scoped to the caller's lab.
import { and, count, eq, inArray } from 'drizzle-orm'
import { createError } from 'h3'
import { memberships, users } from '../db/schema'
import { useDb, type Tx } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { LabMember } from '#shared/types/session'
import { can, ROLE_LABELS, type Role } from '#shared/utils/roles'
import { conflict, lockLab } from './locks'

export async function listMembers(caller: LabCaller): Promise<LabMember[]> {
  const rows = await useDb()
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      since: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.labId, caller.lab.labId))
    .orderBy(users.name)
  return rows.map(r => ({ ...r, since: r.since.toISOString() }))
}

/**
 * Role changes and removals, one at a time per lab (the lab row lock): the last-admin check counts what is
 * committed, so two admins demoting each other leave one admin, and a caller demoted meanwhile may not act.
 */
async function changeMembership<T>(
  caller: LabCaller,
  userId: string,
  action: string,
  dropsAdmin: boolean,
  change: (tx: Tx) => Promise<T>,
): Promise<T> {
  return useDb().transaction(async tx => {
    await lockLab(tx, caller.lab.labId)
    const rows = await tx
      .select({ userId: memberships.userId, role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.labId, caller.lab.labId), inArray(memberships.userId, [caller.userId, userId])))
    const me = rows.find(r => r.userId === caller.userId)
    if (!me || !can(me.role, 'members:manage'))
      throw conflict(
        `Your role in this lab changed meanwhile (now ${me ? ROLE_LABELS[me.role].toLowerCase() : 'not a member'}): you may no longer ${action}`,
      )
    const member = rows.find(r => r.userId === userId)
    if (!member)
      throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such member in this lab' })
    if (member.role === 'admin' && dropsAdmin) {
      const [row] = await tx
        .select({ n: count() })
        .from(memberships)
        .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.role, 'admin')))
      if ((row?.n ?? 0) <= 1)
        throw conflict(`The lab needs at least one admin: make someone else admin before you ${action}`)
    }
    return change(tx)
  })
}

export async function changeRole(caller: LabCaller, userId: string, role: Role): Promise<LabMember> {
  await changeMembership(caller, userId, 'change this role', role !== 'admin', tx =>
    tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.userId, userId))),
  )
  return (await listMembers(caller)).find(m => m.userId === userId)!
}

export async function removeMember(caller: LabCaller, userId: string): Promise<void> {
  await changeMembership(caller, userId, 'remove this member', true, tx =>
    tx.delete(memberships).where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.userId, userId))),
  )
}
