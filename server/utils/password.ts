// Password hashing with Argon2id (RFC 9106) through @node-rs/argon2, at its default cost parameters.
import { hash, verify } from '@node-rs/argon2'
import { dictionary } from '@zxcvbn-ts/language-common'
import type { PasswordChecks } from '#shared/schemas/auth'

export function hashPassword(password: string): Promise<string> {
  return hash(password)
}

// Compared against when the e-mail is unknown, so both cases take the same time.
let decoy: Promise<string> | undefined

export async function verifyPassword(stored: string | null, password: string): Promise<boolean> {
  decoy ??= hash('not-a-real-password')
  const target = stored ?? (await decoy)
  const ok = await verify(target, password).catch(() => false)
  return stored !== null && ok
}

// ── Common and leaked passwords ────────────────────────────────────────────────────────────────────────────
// The list that ships with @zxcvbn-ts/language-common (about 49,000 passwords from public breach corpora, most
// common first). About 380 KB: it stays on the server, and the forms show the server's message.

let common: Set<string> | undefined

export function isCommonPassword(password: string): boolean {
  common ??= new Set((dictionary['passwords-common'] as string[]).map(p => p.toLowerCase()))
  return common.has(password.toLowerCase()) || common.has(password.trim().toLowerCase())
}

/** What the shared password rules need on the server (shared/schemas/auth.ts `passwordProblem`). */
export const serverPasswordChecks: PasswordChecks = { isCommon: isCommonPassword }
