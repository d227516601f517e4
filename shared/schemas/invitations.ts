import { z } from 'zod'
import { ROLES } from '../utils/roles'
import { newPasswordField, passwordProblem, type PasswordChecks } from './auth'
import { labParams } from './labs'
import { safeText } from './text'

export const INVITATION_DAYS = 7

const email = safeText(undefined, 'E-mail')
  .trim()
  .toLowerCase()
  .max(254, 'E-mail is at most 254 characters')
  .email('Enter an e-mail address')

/** An admin invites an address with a role. */
export const invitationCreate = z.object({ email, role: z.enum(ROLES, 'Choose a role') })
export type InvitationCreate = z.infer<typeof invitationCreate>

export const invitationParams = labParams.extend({ invitationId: z.uuid('Invitation id must be a UUID') })

/** The secret in the link: 32 random bytes, base64url. */
export const invitationTokenParams = z.object({
  token: safeText(undefined, 'Invitation link').regex(
    /^[A-Za-z0-9_-]{43}$/,
    'This invitation link is not valid: copy the whole link from the e-mail',
  ),
})

/** The account created when someone without one accepts: the password follows the policy in ./auth. */
const accountFields = {
  name: safeText(undefined, 'Name').trim().min(1, 'Enter your name').max(120, 'Name is at most 120 characters'),
  password: newPasswordField(),
}

/** The new account for the invited `email` (when known): the policy's checks against the address and the name (and
 * `checks`) run once the fields themselves pass. */
export function newAccountFor(email?: string | null, checks: PasswordChecks = {}) {
  return z.object(accountFields).superRefine((account, ctx) => {
    const problem = passwordProblem(account.password, email ? { email, name: account.name } : null, checks)
    if (problem) ctx.addIssue({ code: 'custom', path: ['password'], message: problem })
  })
}
export const newAccount = newAccountFor()
export type NewAccount = z.infer<typeof newAccount>

/** Accepting: empty when signed in with the invited address; name and password to create the account. */
export const invitationAccept = z.object(accountFields).partial()
export type InvitationAccept = z.infer<typeof invitationAccept>
