// Which errors mean "the database cannot answer right now" (down, restarting, unreachable, saturated or too slow),
// as opposed to a bug or bad input. Those answer 503 with Retry-After (server/errors/database.ts), never 500.

/** Seconds a client should wait before trying again while the database is unavailable. */
export const RETRY_AFTER_S = 5

// Socket-level failures reaching the server (Node's error codes).
const NETWORK_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ENOTFOUND',
  'EAI_AGAIN',
  'EHOSTUNREACH',
  'ENETUNREACH',
])
// PostgreSQL SQLSTATE codes (PostgreSQL 15 documentation, Appendix A "PostgreSQL Error Codes"): class 08 connection
// exception; 53300 too_many_connections; 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now;
// 57014 query_canceled (our statement_timeout); 55P03 lock_not_available (our lock_timeout).
const SQLSTATES = new Set(['53300', '57P01', '57P02', '57P03', '57014', '55P03'])
// node-postgres's own messages for a connection it lost or could not get (pg 8, lib/client.js and pg-pool).
const MESSAGES =
  /Connection terminated|timeout exceeded when trying to connect|Client has encountered a connection error|Connection refused|connection not open/i

function* causes(error: unknown): Generator<{ code?: unknown; message?: unknown }> {
  const seen = new Set<unknown>()
  let e = error as { cause?: unknown } | undefined
  while (e && typeof e === 'object' && !seen.has(e)) {
    seen.add(e)
    yield e as { code?: unknown; message?: unknown }
    for (const inner of (e as { errors?: unknown[] }).errors ?? []) yield* causes(inner) // AggregateError (several addresses)
    e = e.cause as typeof e
  }
}

export function isDatabaseUnavailable(error: unknown): boolean {
  for (const e of causes(error)) {
    const code = typeof e.code === 'string' ? e.code : ''
    if (NETWORK_CODES.has(code) || SQLSTATES.has(code) || code.startsWith('08')) return true
    if (typeof e.message === 'string' && MESSAGES.test(e.message)) return true
  }
  return false
}
