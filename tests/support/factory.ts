// Test data written straight to the test database, so tests that change things never touch the demo rows.
import { randomUUID } from 'node:crypto'
import { readFileSync } from 'node:fs'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import { inject } from 'vitest'
import { labs, memberships, users } from '../../server/db/schema'
import { hashPassword } from '../../server/utils/password'
import type { Role } from '../../shared/utils/roles'

export const TEST_PASSWORD = 'test-password-123'

export async function makeLab(members: Role[]) {
  const pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 2 })
  const db = drizzle(pool)
  const tag = randomUUID().slice(0, 8)
  const [lab] = await db
    .insert(labs)
    .values({ slug: `test-${tag}`, name: `Test lab ${tag}` })
    .returning()
  const passwordHash = await hashPassword(TEST_PASSWORD)
  const people = []
  for (const [i, role] of members.entries()) {
    const [user] = await db
      .insert(users)
      .values({ email: `${role}-${i}-${tag}@test.example`, name: `${role} ${i} ${tag}`, passwordHash })
      .returning()
    await db.insert(memberships).values({ userId: user!.id, labId: lab!.id, role })
    people.push({ ...user!, role })
  }
  await pool.end()
  return { lab: lab!, people }
}

export function fixtureDocument(name = 't-junction-basic'): Record<string, any> {
  return JSON.parse(readFileSync(new URL(`../fixtures/documents/${name}.json`, import.meta.url), 'utf8'))
}
