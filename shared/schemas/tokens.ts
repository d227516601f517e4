// Personal API tokens: what the account page sends to create one, and the rule that a token's role may do
// nothing the person may not do in that lab.
import { z } from 'zod'
import { ROLE_PERMISSIONS, ROLES, type Role } from '../utils/roles'
import { safeText } from './text'

export const TOKEN_NAME_MAX = 80
export const TOKENS_PER_PERSON = 20

export const tokenCreate = z.object({
  name: safeText(undefined, 'Token name')
    .trim()
    .min(1, 'Give the token a name, e.g. "sweep script"')
    .max(TOKEN_NAME_MAX, `Token name is at most ${TOKEN_NAME_MAX} characters`),
  labId: z.uuid('Choose the lab the token works in'),
  role: z.enum(ROLES, { error: `Role must be one of ${ROLES.join(', ')}` }),
})
export type TokenCreate = z.infer<typeof tokenCreate>

export const tokenParams = z.object({ tokenId: z.uuid('Token id must be a UUID') })

/** Whether a token with `tokenRole` stays within `personRole`: every permission of the token's role is the person's. */
export function roleWithin(tokenRole: Role, personRole: Role): boolean {
  return ROLE_PERMISSIONS[tokenRole].every(p => ROLE_PERMISSIONS[personRole].includes(p))
}

/** The roles a person with `personRole` may give a token, in the roles' order. */
export const tokenRolesFor = (personRole: Role): Role[] => ROLES.filter(r => roleWithin(r, personRole))
