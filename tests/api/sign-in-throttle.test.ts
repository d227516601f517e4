// Sign-in limits under attack, over real HTTP against the built server and PostgreSQL: concurrent guesses are counted
// before the password is checked, X-Forwarded-For is believed only from a configured proxy, the per-address limit
// holds, and strangers' failures never keep the owner out of a browser they signed in with before.
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { startServer, type ServerInstance } from '../support/instance'

const login = (api: ApiClient, email: string, password: string, headers: Record<string, string> = {}) =>
  api.request('POST', '/api/auth/login', { email, password }, { headers })
const statuses = (results: Array<{ status: number }>) =>
  results.map(r => r.status).reduce<Record<number, number>>((acc, s) => ({ ...acc, [s]: (acc[s] ?? 0) + 1 }), {})

// Two more instances on the same database, with a small per-address limit: one trusts no proxy (the default), the
// other trusts the loopback proxy in front of it.
let direct: ServerInstance
let behindProxy: ServerInstance
const used = new Set<string>()
async function sql(text: string, values: unknown[] = []) {
  const client = new pg.Client({ connectionString: inject('databaseUrl') })
  await client.connect()
  try {
    return (await client.query(text, values)).rows
  } finally {
    await client.end()
  }
}
const person = async () => {
  const {
    people: [p],
  } = await makeLab(['designer'])
  used.add(p!.email)
  return p!
}

beforeAll(async () => {
  const databaseUrl = inject('databaseUrl')
  const env = { DW_MAIL_WORKER: '0', DW_SIGNIN_MAX_PER_IP: '3' }
  ;[direct, behindProxy] = await Promise.all([
    startServer({ databaseUrl, name: 'api-throttle-direct', env }),
    startServer({ databaseUrl, name: 'api-throttle-proxy', env: { ...env, DW_TRUSTED_PROXIES: '127.0.0.1/8, ::1' } }),
  ])
})

afterAll(async () => {
  await Promise.all([direct?.stop(), behindProxy?.stop()])
  // This file's failures come from 127.0.0.1 like every other test's: take them out of the per-address count.
  await sql('delete from sign_in_failures where email = any($1)', [[...used]])
})

describe('sign-in throttling', () => {
  it('checks at most the limit of 40 concurrent wrong passwords for one account; the rest get 429 with Retry-After', async () => {
    const victim = await person()
    const results = await Promise.all(
      Array.from({ length: 40 }, () => login(new ApiClient(), victim.email, 'wrong-guess-000')),
    )
    expect(statuses(results)).toEqual({ 401: 5, 429: 35 })
    const limited = results.find(r => r.status === 429)!
    expect(limited.json.message).toMatch(/Too many failed sign-ins for this account\. Wait 15 minutes/)
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(800)
    // And the right password from an unknown device waits too: the limit is per account.
    expect((await login(new ApiClient(), victim.email, TEST_PASSWORD)).status).toBe(429)
  })

  it('keeps one message for a wrong password and an unknown e-mail, also once limited', async () => {
    const known = await person()
    const unknown = `nobody-${known.email}`
    used.add(unknown)
    const a = await Promise.all(Array.from({ length: 7 }, () => login(new ApiClient(), known.email, 'wrong-guess-000')))
    const b = await Promise.all(Array.from({ length: 7 }, () => login(new ApiClient(), unknown, 'wrong-guess-000')))
    expect(statuses(a)).toEqual(statuses(b))
    expect(a.find(r => r.status === 401)!.json.message).toBe(b.find(r => r.status === 401)!.json.message)
    expect(a.find(r => r.status === 429)!.json.message).toBe(b.find(r => r.status === 429)!.json.message)
  })

  it('lets the owner in from a known device while strangers are locked out of the account', async () => {
    const owner = await person()
    const laptop = new ApiClient()
    await laptop.signIn(owner.email, TEST_PASSWORD)
    expect(laptop.cookies.get('dw_device')).toMatch(/^[A-Za-z0-9_-]{43}$/)
    expect((await laptop.post('/api/auth/logout')).status).toBe(200)
    expect(laptop.cookies.has('dw_device')).toBe(true) // signing out keeps the device known

    // A stranger fails 12 times; their own account's device cookie and a made-up one do not help them.
    const stranger = new ApiClient()
    const attack = await Promise.all(Array.from({ length: 12 }, () => login(stranger, owner.email, 'wrong-guess-000')))
    expect(statuses(attack)).toEqual({ 401: 5, 429: 7 })
    const other = await person()
    const theirs = new ApiClient()
    await theirs.signIn(other.email, TEST_PASSWORD)
    expect((await login(theirs, owner.email, TEST_PASSWORD)).status).toBe(429)
    const forged = new ApiClient()
    forged.cookies.set('dw_device', 'A'.repeat(43))
    expect((await login(forged, owner.email, TEST_PASSWORD)).status).toBe(429)

    // The owner's laptop still signs in, and its session works.
    const back = await login(laptop, owner.email, TEST_PASSWORD)
    expect(back.status).toBe(200)
    expect((await laptop.get('/api/auth/session')).json.user.email).toBe(owner.email)
  })

  it('limits a known device on its own: stolen device cookies get no more guesses than the limit', async () => {
    const owner = await person()
    const device = new ApiClient()
    await device.signIn(owner.email, TEST_PASSWORD)
    const guesses = await Promise.all(Array.from({ length: 20 }, () => login(device, owner.email, 'wrong-guess-000')))
    expect(statuses(guesses)).toEqual({ 401: 5, 429: 15 })
    expect(guesses.find(r => r.status === 429)!.json.message).toMatch(/Too many failed sign-ins for this account/)
  })

  it('gives back the place of a right password: the owner’s own slips do not add up', async () => {
    const owner = await person()
    const api = new ApiClient()
    for (let round = 0; round < 3; round++) {
      for (let i = 0; i < 4; i++) expect((await login(api, owner.email, 'wrong-guess-000')).status).toBe(401)
      api.cookies.delete('dw_device') // an unknown device each round
      expect((await login(api, owner.email, TEST_PASSWORD)).status).toBe(200)
      api.cookies.delete('dw_device')
    }
  })

  it('ignores X-Forwarded-For without a trusted proxy: every guess counts under the socket address', async () => {
    // Start this address from zero (the earlier tests' guesses came from it too).
    await sql('delete from sign_in_failures where ip = $1', ['127.0.0.1'])
    const results = []
    const forged = []
    for (let i = 0; i < 5; i++) {
      const someone = await person()
      forged.push(`203.0.113.${i + 1}`)
      results.push(
        await login(new ApiClient(direct.baseURL), someone.email, 'wrong-guess-000', { 'x-forwarded-for': forged[i]! }),
      )
    }
    expect(results.map(r => r.status)).toEqual([401, 401, 401, 429, 429])
    expect(results[3]!.json.message).toMatch(/Too many failed sign-ins from this network/)
    expect(
      await sql('select ip, count(*)::int as n from sign_in_failures where ip = any($1) group by ip', [
        [...forged, '127.0.0.1'],
      ]),
    ).toEqual([{ ip: '127.0.0.1', n: 3 }])
  })

  it('believes X-Forwarded-For from a configured proxy, and holds the per-address limit under concurrency', async () => {
    const emails = await Promise.all(Array.from({ length: 12 }, async () => (await person()).email))
    const base = behindProxy.baseURL
    // 12 concurrent guesses at 12 accounts from one client address behind the proxy: the limit of 3 holds.
    const burst = await Promise.all(
      emails.map(email => login(new ApiClient(base), email, 'wrong-guess-000', { 'x-forwarded-for': '203.0.113.50' })),
    )
    expect(statuses(burst)).toEqual({ 401: 3, 429: 9 })
    // A client cannot escape by prepending addresses: the proxy appends the real one, and that is what counts.
    expect(
      (
        await login(new ApiClient(base), emails[0]!, 'wrong-guess-000', {
          'x-forwarded-for': '198.51.100.9, 203.0.113.50',
        })
      ).status,
    ).toBe(429)
    // Another client address behind the same proxy is counted on its own.
    expect(
      (await login(new ApiClient(base), emails[1]!, 'wrong-guess-000', { 'x-forwarded-for': '203.0.113.51' })).status,
    ).toBe(401)
  })
})
