import type { Role } from '../utils/roles'

/** An invitation as the lab's admins see it (never its token). */
export interface PendingInvitation {
  id: string
  email: string
  role: Role
  invitedByName: string
  createdAt: string
  expiresAt: string
  expired: boolean
}

/** What the link shows to whoever holds it. */
export interface InvitationInfo {
  labName: string
  role: Role
  email: string
  expiresAt: string
  expired: boolean
  /** An account with the invited address exists: accepting needs signing in as it. */
  hasAccount: boolean
}

export interface InvitationAccepted {
  labId: string
  role: Role
  newAccount: boolean
}
