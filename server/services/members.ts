// A lab's members. Every query is scoped to the caller's lab.
import { and, count, eq } from 'drizzle-orm'
import { createError } from 'h3'
import { memberships, users } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { LabMember } from '../../shared/types/session'
import type { Role } from '../../shared/utils/roles'

export async function listMembers(caller: LabCaller): Promise<LabMember[]> {
  const rows = await useDb().select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, since: memberships.createdAt })
    .from(memberships).innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.labId, caller.lab.labId)).orderBy(users.name)
  return rows.map(r => ({ ...r, since: r.since.toISOString() }))
}

async function findMember(caller: LabCaller, userId: string) {
  const [row] = await useDb().select().from(memberships)
    .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.userId, userId)))
  if (!row) throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such member in this lab' })
  return row
}

async function assertNotLastAdmin(caller: LabCaller, member: { role: Role }, action: string) {
  if (member.role !== 'admin') return
  const [row] = await useDb().select({ n: count() }).from(memberships)
    .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.role, 'admin')))
  if ((row?.n ?? 0) <= 1) {
    throw createError({ statusCode: 409, statusMessage: 'Conflict', message: `The lab needs at least one admin: make someone else admin before you ${action}` })
  }
}

export async function changeRole(caller: LabCaller, userId: string, role: Role): Promise<LabMember> {
  const member = await findMember(caller, userId)
  if (role !== 'admin') await assertNotLastAdmin(caller, member, 'change this role')
  await useDb().update(memberships).set({ role })
    .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.userId, userId)))
  return (await listMembers(caller)).find(m => m.userId === userId)!
}

export async function removeMember(caller: LabCaller, userId: string): Promise<void> {
  const member = await findMember(caller, userId)
  await assertNotLastAdmin(caller, member, 'remove this member')
  await useDb().delete(memberships)
    .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.userId, userId)))
}
