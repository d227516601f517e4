import { describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'

describe('sign-in and sessions (real server, real PostgreSQL)', () => {
  it('signs in the demo designer and returns their labs', async () => {
    const api = await signedIn('designer@quillmere.example')
    const session = await api.get('/api/auth/session')
    expect(session.status).toBe(200)
    expect(session.json.user.email).toBe('designer@quillmere.example')
    expect(session.json.memberships.map((m: { slug: string; role: string }) => `${m.slug}:${m.role}`).sort()).toEqual([
      'orrin-valley:reviewer',
      'quillmere:designer',
    ])
  })

  it('keeps the credential in an httpOnly SameSite cookie', async () => {
    const api = new ApiClient()
    const res = await api.post('/api/auth/login', { email: 'designer@quillmere.example', password: 'drop-demo-2026' })
    const cookie = res.headers.getSetCookie().find(c => c.startsWith('dw_session='))!
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(JSON.stringify(res.json)).not.toContain(cookie.split(';')[0]!.split('=')[1])
  })

  it('gives one generic message for a wrong password and for an unknown e-mail', async () => {
    const api = new ApiClient()
    const wrong = await api.post('/api/auth/login', { email: 'reviewer@quillmere.example', password: 'nope-nope' })
    const unknown = await api.post('/api/auth/login', { email: 'nobody@quillmere.example', password: 'nope-nope' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.json.message).toBe(unknown.json.message)
    expect(api.cookies.has('dw_session')).toBe(false)
  })

  it('throttles repeated failures for one e-mail, even with the right password after', async () => {
    const {
      people: [person],
    } = await makeLab(['designer'])
    const api = new ApiClient()
    for (let i = 0; i < 5; i++)
      expect((await api.post('/api/auth/login', { email: person!.email, password: 'wrong' })).status).toBe(401)
    const blocked = await api.post('/api/auth/login', { email: person!.email, password: TEST_PASSWORD })
    expect(blocked.status).toBe(429)
    expect(blocked.json.message).toMatch(/Too many failed sign-ins/)
  })

  it('ends the session on sign-out, on the server', async () => {
    const api = await signedIn('experimenter@quillmere.example')
    const stolen = new Map(api.cookies)
    expect((await api.post('/api/auth/logout')).status).toBe(200)
    const replay = new ApiClient()
    replay.cookies = stolen
    expect((await replay.get('/api/auth/session')).status).toBe(401)
  })

  it('ends an expired session on the server, whatever the cookie says', async () => {
    const api = await signedIn('reviewer@quillmere.example')
    expect((await api.get('/api/auth/session')).status).toBe(200)
    const token = api.cookies.get('dw_session')!
    const { createHash } = await import('node:crypto')
    const pg = await import('pg')
    const { inject } = await import('vitest')
    const client = new pg.default.Client({ connectionString: inject('databaseUrl') })
    await client.connect()
    await client.query(`update sessions set expires_at = now() - interval '1 second' where token_hash = $1`, [
      createHash('sha256').update(token).digest('hex'),
    ])
    await client.end()
    expect((await api.get('/api/auth/session')).status).toBe(401)
    expect((await api.get('/api/labs')).status).toBe(401)
  })

  it('answers 400 with the zod issues for a malformed body, never 500', async () => {
    const api = new ApiClient()
    const res = await api.post('/api/auth/login', { email: 42 })
    expect(res.status).toBe(400)
    expect(res.json.data.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'password'])
    const notJson = await api.request('POST', '/api/auth/login', '{"email":', {
      headers: { 'content-type': 'application/json' },
    })
    expect(notJson.status).toBe(400)
    const long = await api.post('/api/auth/login', { email: `${'x'.repeat(300)}@a.example`, password: 'p' })
    expect(long.status).toBe(400)
  })

  it('answers 401 to every API route without a session', async () => {
    const api = new ApiClient()
    for (const [method, path] of [
      ['GET', '/api/auth/session'],
      ['GET', '/api/labs'],
      ['GET', '/api/labs/8f27fa87-b6bd-47d9-a2cc-3643ca281458/members'],
      ['POST', '/api/auth/logout'],
      ['GET', '/api/not-a-route'],
    ] as const) {
      expect((await api.request(method, path)).status, `${method} ${path}`).toBe(401)
    }
  })
})
