import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../db/schema'
import { useConfig } from './config'

export type Db = NodePgDatabase<typeof schema>
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]

let db: Db | undefined
let pool: pg.Pool | undefined

/** The database URL: NUXT_DATABASE_URL (runtime config) or DATABASE_URL. */
export function databaseUrl(): string {
  const url = useConfig().databaseUrl
  if (!url)
    throw new Error(
      'DATABASE_URL is not set: run `npm start` (starts a local PostgreSQL) or set DATABASE_URL to a managed server',
    )
  return url
}

/**
 * The pool and its time-outs (DEVELOPERS.md, "Database work"). A request path checks out at most one connection
 * at a time; these bound how long anything can wait, so a fault costs one request, never the server:
 * - acquire: a request waits at most DW_DB_ACQUIRE_MS (5 s) for a free connection, then answers 503;
 * - statement_timeout (DW_DB_STATEMENT_MS, 10 s) and lock_timeout (DW_DB_LOCK_MS, 5 s) end a stuck statement;
 * - idle_in_transaction_session_timeout (DW_DB_IDLE_TX_MS, 10 s) ends a transaction its holder forgot.
 */
export function poolConfig(): pg.PoolConfig {
  const { db } = useConfig()
  return {
    connectionString: databaseUrl(),
    max: db.pool,
    connectionTimeoutMillis: db.acquireMs,
    idleTimeoutMillis: 30_000,
    statement_timeout: db.statementMs,
    idle_in_transaction_session_timeout: db.idleInTransactionMs,
    options: `-c lock_timeout=${db.lockMs}`,
    application_name: 'dropwright',
  }
}

export function useDb(): Db {
  if (!db) {
    pool = new pg.Pool(poolConfig())
    // An idle connection that the server drops (restart, fail-over) must not take the process down with it.
    pool.on('error', error => console.error('[db] idle connection lost:', error.message))
    db = drizzle(pool, { schema })
  }
  return db
}

/** The pg pool itself (the health probe's `select 1`). */
export function usePool(): pg.Pool {
  useDb()
  return pool!
}

export async function closeDb(): Promise<void> {
  await pool?.end()
  pool = undefined
  db = undefined
}
