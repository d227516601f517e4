// Who is calling, and may they? Lab-scoped routes call `requireLabPermission` first, always.
import type { H3Event } from 'h3'
import { createError } from 'h3'
import { can, type Permission } from '#shared/utils/roles'
import type { LabMembership, SessionData } from '#shared/types/session'

declare module 'h3' {
  interface H3EventContext {
    session?: SessionData | null
  }
}

export function requireSession(event: H3Event): SessionData {
  const session = event.context.session
  if (!session) throw createError({ statusCode: 401, statusMessage: 'Unauthorized', message: 'Sign in first' })
  return session
}

export interface LabCaller {
  userId: string
  lab: LabMembership
}

/** 404 when the caller is not in the lab (nothing leaks about other labs), 403 when the role may not. */
export function requireLabPermission(event: H3Event, labId: string, permission: Permission): LabCaller {
  const session = requireSession(event)
  const lab = session.memberships.find(m => m.labId === labId)
  if (!lab) throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such lab' })
  if (!can(lab.role, permission)) {
    throw createError({
      statusCode: 403,
      statusMessage: 'Forbidden',
      message: `Your role (${lab.role}) may not do this here`,
    })
  }
  return { userId: session.user.id, lab }
}
