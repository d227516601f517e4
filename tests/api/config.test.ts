// A wrong environment variable stops the built server at start, with a message that names it.
import { describe, expect, inject, it } from 'vitest'
import { startServer } from '../support/instance'

describe('configuration at start', () => {
  it('refuses to start with a wrong value and says which variable and what it must be', async () => {
    const started = startServer({
      databaseUrl: inject('databaseUrl'),
      name: 'api-bad-config',
      env: { DW_DB_POOL: 'ten', DW_MAIL_WORKER: 'maybe' },
    })
    const error = await started.then(
      async s => {
        await s.stop()
        return null
      },
      (e: Error) => e,
    )
    expect(error?.message).toMatch(/server exited early/)
    expect(error?.message).toContain('DW_DB_POOL must be a whole number from 1 to 500 (got "ten")')
    expect(error?.message).toContain('DW_MAIL_WORKER must be 1 (on) or 0 (off) (got "maybe")')
  })
})
