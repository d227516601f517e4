// Password hashing with Argon2id (RFC 9106) through @node-rs/argon2, at its default cost parameters.
import { hash, verify } from '@node-rs/argon2'

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
