import type { Role } from '../utils/roles'

/** A personal API token as the account page lists it (never the token itself). */
export interface ApiTokenInfo {
  id: string
  name: string
  labId: string
  labName: string
  role: Role
  /** The token's first characters, to tell tokens apart. */
  prefix: string
  createdAt: string
  lastUsedAt: string | null
  revokedAt: string | null
}

/** The answer to creating a token: the only time the token itself is shown. */
export interface NewApiToken extends ApiTokenInfo {
  token: string
}
