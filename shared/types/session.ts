import type { Role } from '../utils/roles'

export interface LabMembership {
  labId: string
  slug: string
  name: string
  kind: 'research' | 'fabrication'
  role: Role
}
export interface SessionUser {
  id: string
  email: string
  name: string
}
export interface SessionData {
  user: SessionUser
  memberships: LabMembership[]
}
export interface LabMember {
  userId: string
  name: string
  email: string
  role: Role
  since: string
}
