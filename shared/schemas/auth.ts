import { z } from 'zod'
import { safeText } from './text'

const email = safeText(undefined, 'E-mail')
  .trim()
  .toLowerCase()
  .max(254, 'E-mail is at most 254 characters')
  .email('Enter an e-mail address')

export const signInBody = z.object({
  email,
  password: safeText(undefined, 'Password')
    .min(1, 'Enter your password')
    .max(200, 'Password is at most 200 characters'),
})
export type SignInBody = z.infer<typeof signInBody>

// ── Password policy: one rule set for every form that sets a password (new account, change, reset) ───────────

export const PASSWORD_MIN = 10
export const PASSWORD_MAX = 200
export const PASSWORD_HINT = `At least ${PASSWORD_MIN} characters; not a common password, your e-mail or your name.`

/** Whose password it is: the rules refuse passwords made of the account's own e-mail or name. */
export interface PasswordOwner {
  email: string
  name?: string | null
}

/**
 * Extra checks the caller supplies. The server passes `isCommon` (a list of leaked passwords, too big to send to the
 * browser: server/utils/password.ts); the browser leaves it out and shows the server's message instead.
 */
export interface PasswordChecks {
  isCommon?: (password: string) => boolean
}

const letters = (value: string) =>
  value
    .toLowerCase()
    .normalize('NFKC')
    .replace(/[^\p{L}\p{N}]+/gu, '')

/** What is wrong with `password` for `owner`, as a sentence that says what to do, or null when it is acceptable. */
export function passwordProblem(
  password: string,
  owner?: PasswordOwner | null,
  checks: PasswordChecks = {},
): string | null {
  if ([...password].length < PASSWORD_MIN) return `Choose a password of at least ${PASSWORD_MIN} characters`
  if ([...password].length > PASSWORD_MAX) return `Password is at most ${PASSWORD_MAX} characters`
  if (/^(.)\1*$/su.test(password))
    return 'Do not repeat one character: choose a password mixing several words or characters'
  if (owner) {
    const pw = letters(password)
    const address = letters(owner.email)
    const local = letters(owner.email.split('@')[0] ?? '')
    const name = letters(owner.name ?? '')
    // The password itself, or it with digits added at the end ("ines2026").
    const bare = pw.replace(/\p{N}+$/u, '')
    const own = [address, local, name].filter(v => v.length >= 3)
    if ((address && pw.includes(address)) || own.some(v => v === pw || v === bare)) {
      return 'Do not use your e-mail address or your name as the password: choose something others cannot guess from them'
    }
  }
  if (checks.isCommon?.(password)) {
    return 'This password is on lists of common and leaked passwords: choose another (a few unrelated words work well)'
  }
  return null
}

/** A new password for `owner`, as a zod field: the rules above, one issue with the message that says what to do. */
export function newPasswordField(owner?: PasswordOwner | null, checks: PasswordChecks = {}) {
  return safeText('Enter a new password', 'Password').superRefine((password, ctx) => {
    const problem = passwordProblem(password, owner, checks)
    if (problem) ctx.addIssue({ code: 'custom', message: problem })
  })
}

/** Signed in: the current password and the new one. Ends every other session of the person. */
export function passwordChangeBody(owner?: PasswordOwner | null, checks: PasswordChecks = {}) {
  return z
    .object({
      currentPassword: safeText('Enter your current password', 'Password')
        .min(1, 'Enter your current password')
        .max(PASSWORD_MAX, `Password is at most ${PASSWORD_MAX} characters`),
      newPassword: newPasswordField(owner, checks),
    })
    .refine(b => b.currentPassword !== b.newPassword, {
      path: ['newPassword'],
      message: 'Choose a new password that differs from the current one',
    })
}
export type PasswordChange = z.infer<ReturnType<typeof passwordChangeBody>>

/** The request form: always answered the same, whether or not an account has the address. */
export const passwordResetRequest = z.object({ email })
export type PasswordResetRequest = z.infer<typeof passwordResetRequest>

/** The secret in a reset link: 32 random bytes, base64url. */
export const passwordResetParams = z.object({
  token: safeText(undefined, 'Reset link').regex(
    /^[A-Za-z0-9_-]{43}$/,
    'This reset link is not valid: copy the whole link from the e-mail, or ask for a new one',
  ),
})

/** Choosing the new password from a reset link. */
export function passwordResetBody(owner?: PasswordOwner | null, checks: PasswordChecks = {}) {
  return z.object({ password: newPasswordField(owner, checks) })
}
export type PasswordResetBody = z.infer<ReturnType<typeof passwordResetBody>>

/** Minutes a reset link works. */
export const PASSWORD_RESET_MINUTES = 60
