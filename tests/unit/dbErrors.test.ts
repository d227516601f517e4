// Which failures count as "database unavailable" (503) — SQLSTATEs from the PostgreSQL 15 documentation,
// Appendix A; node-postgres messages from pg 8 / pg-pool.
import { describe, expect, it } from 'vitest'
import { isDatabaseUnavailable } from '../../server/utils/dbErrors'

const pgError = (code: string, message = 'x') => Object.assign(new Error(message), { code })

describe('isDatabaseUnavailable', () => {
  it.each([
    ['refused socket', Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' })],
    ['admin_shutdown 57P01', pgError('57P01', 'terminating connection due to administrator command')],
    ['cannot_connect_now 57P03', pgError('57P03', 'the database system is starting up')],
    ['connection_failure 08006', pgError('08006')],
    ['too_many_connections 53300', pgError('53300')],
    ['statement_timeout 57014', pgError('57014', 'canceling statement due to statement timeout')],
    ['lock_timeout 55P03', pgError('55P03', 'canceling statement due to lock timeout')],
    ['pool acquire time-out', new Error('timeout exceeded when trying to connect')],
    ['lost connection', new Error('Connection terminated unexpectedly')],
    ['wrapped by the query builder', new Error('Failed query: select 1', { cause: pgError('57P01') })],
    [
      'several addresses',
      Object.assign(new AggregateError([Object.assign(new Error('r'), { code: 'ECONNREFUSED' })], 'all failed')),
    ],
  ])('%s → unavailable', (_, error) => expect(isDatabaseUnavailable(error)).toBe(true))

  it.each([
    ['unique violation 23505', pgError('23505', 'duplicate key value')],
    ['syntax error 42601', pgError('42601')],
    ['a bug', new TypeError('Cannot read properties of undefined')],
    ['nothing', undefined],
  ])('%s → not unavailable', (_, error) => expect(isDatabaseUnavailable(error)).toBe(false))
})
