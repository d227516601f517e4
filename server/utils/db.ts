import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../db/schema'

export type Db = NodePgDatabase<typeof schema>

let db: Db | undefined
let pool: pg.Pool | undefined

/** The database URL: NUXT_DATABASE_URL (runtime config) or DATABASE_URL. */
export function databaseUrl(): string {
  const url = process.env.NUXT_DATABASE_URL || process.env.DATABASE_URL
  if (!url) throw new Error('DATABASE_URL is not set: run `npm start` (starts a local PostgreSQL) or set DATABASE_URL to a managed server')
  return url
}

export function useDb(): Db {
  if (!db) {
    pool = new pg.Pool({ connectionString: databaseUrl(), max: Number(process.env.DW_DB_POOL ?? 10) })
    db = drizzle(pool, { schema })
  }
  return db
}

/** The pg pool, for the few hot queries kept as named prepared statements (planned once per connection). */
export function usePool(): pg.Pool {
  useDb()
  return pool!
}

export async function closeDb(): Promise<void> {
  await pool?.end()
  pool = undefined
  db = undefined
}
