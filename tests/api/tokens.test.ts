// Personal API tokens over the real server: made once and shown once, hashed at rest, scoped to one lab and a role
// within the person's, accepted as Bearer on /api/v1 and the lab routes only, no CSRF check without cookies,
// revocation and demotion end them; and the Python flow sweep in docs/ runs through a token.
import { execFile } from 'node:child_process'
import { createHash } from 'node:crypto'
import { promisify } from 'node:util'
import pg from 'pg'
import { afterAll, describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'

const run = promisify(execFile)
const pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 2 })
afterAll(() => pool.end())
const as = (email: string) => new ApiClient().signIn(email, TEST_PASSWORD)

/** A client that sends only `Authorization: Bearer`, like a script (no cookies). */
function bearer(token: string) {
  const base = inject('baseURL')
  return async (method: string, path: string, body?: unknown, headers: Record<string, string> = {}) => {
    const res = await fetch(base + path, {
      method,
      body: body === undefined ? undefined : JSON.stringify(body),
      headers: {
        authorization: `Bearer ${token}`,
        ...(body === undefined ? {} : { 'content-type': 'application/json' }),
        ...headers,
      },
    })
    const text = await res.text()
    return { status: res.status, json: text ? JSON.parse(text) : null }
  }
}

describe('personal API tokens', () => {
  it("are shown once, kept as SHA-256 only, and refuse a role above the person's", async () => {
    const {
      lab,
      people: [designer],
    } = await makeLab(['designer'])
    const d = await as(designer!.email)
    const made = await d.post('/api/account/tokens', { name: 'sweep script', labId: lab.id, role: 'designer' })
    expect(made.status).toBe(201)
    expect(made.json.token).toMatch(/^dwt_[A-Za-z0-9_-]{43}$/)
    const list = await d.get('/api/account/tokens')
    expect(list.json).toEqual([
      expect.objectContaining({
        id: made.json.id,
        name: 'sweep script',
        role: 'designer',
        labName: lab.name,
        revokedAt: null,
      }),
    ])
    expect(JSON.stringify(list.json)).not.toContain(made.json.token)
    const { rows } = await pool.query('select * from api_tokens where id = $1', [made.json.id])
    expect(rows[0].token_hash).toBe(createHash('sha256').update(made.json.token).digest('hex'))
    expect(JSON.stringify(rows[0])).not.toContain(made.json.token.slice(10))

    const higher = await d.post('/api/account/tokens', { name: 'too much', labId: lab.id, role: 'admin' })
    expect(higher.status).toBe(400)
    expect(higher.json.message).toMatch(
      /role: a token may do only what you may do in .* \(you are Designer\): choose Designer, Lab member$/,
    )
    const { lab: other } = await makeLab(['admin'])
    expect(
      (await d.post('/api/account/tokens', { name: 'elsewhere', labId: other.id, role: 'fabricator' })).status,
    ).toBe(404)
  })

  it('work as Bearer in their lab with their role only, not on account routes, and without a CSRF check', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const { lab: other } = await makeLab(['admin'])
    const a = await as(admin!.email)
    const reviewerToken = (await a.post('/api/account/tokens', { name: 'read only', labId: lab.id, role: 'reviewer' }))
      .json.token
    const designerToken = (await a.post('/api/account/tokens', { name: 'saves', labId: lab.id, role: 'designer' })).json
      .token
    const r = bearer(reviewerToken)
    const labsSeen = await r('GET', '/api/labs')
    expect(labsSeen.status).toBe(200)
    expect(labsSeen.json.map((l: { labId: string }) => l.labId)).toEqual([lab.id])
    expect((await r('GET', `/api/labs/${lab.id}/designs`)).status).toBe(200)
    const refused = await r('POST', `/api/labs/${lab.id}/designs`, {
      name: 'By a reviewer token',
      document: fixtureDocument(),
    })
    expect(refused.status).toBe(403) // the admin may, the token's role may not
    expect((await r('GET', `/api/labs/${other.id}/designs`)).status).toBe(404)
    expect((await r('GET', `/api/labs/${lab.id}/members`)).status).toBe(200)
    expect((await r('PATCH', `/api/labs/${lab.id}/members/${admin!.id}`, { role: 'designer' })).status).toBe(403)
    // Account routes never take a token (it cannot make more tokens or change the password).
    expect((await r('GET', '/api/account/tokens')).status).toBe(401)
    expect((await r('POST', '/api/account/tokens', { name: 'more', labId: lab.id, role: 'reviewer' })).status).toBe(401)
    expect((await r('POST', '/api/auth/logout-everywhere', {})).status).toBe(401)

    // A script's write with a foreign Origin and no cookies is not a forged browser request: it goes through.
    const d = bearer(designerToken)
    const saved = await d(
      'POST',
      `/api/labs/${lab.id}/designs`,
      { name: 'From a script', document: fixtureDocument() },
      { origin: 'https://elsewhere.example' },
    )
    expect(saved.status).toBe(201)
    // With cookies as well, the browser rule applies again.
    const withCookie = await fetch(`${inject('baseURL')}/api/labs/${lab.id}/designs`, {
      method: 'POST',
      body: JSON.stringify({ name: 'Forged', document: fixtureDocument() }),
      headers: {
        authorization: `Bearer ${designerToken}`,
        'content-type': 'application/json',
        origin: 'https://elsewhere.example',
        cookie: 'dw_session=x',
      },
    })
    expect(withCookie.status).toBe(403)
    expect((await bearer('dwt_' + 'x'.repeat(43))('GET', '/api/labs')).status).toBe(401)
  })

  it("stop working when revoked or when the person's role no longer covers them", async () => {
    const {
      lab,
      people: [designer],
    } = await makeLab(['designer'])
    const d = await as(designer!.email)
    const first = (await d.post('/api/account/tokens', { name: 'one', labId: lab.id, role: 'designer' })).json
    const second = (await d.post('/api/account/tokens', { name: 'two', labId: lab.id, role: 'experimenter' })).json
    expect((await bearer(first.token)('GET', `/api/labs/${lab.id}/designs`)).status).toBe(200)
    const revoked = await d.delete(`/api/account/tokens/${first.id}`)
    expect(revoked.json.revokedAt).not.toBeNull()
    const after = await bearer(first.token)('GET', `/api/labs/${lab.id}/designs`)
    expect(after.status).toBe(401)
    expect(after.json.message).toMatch(/revoked/)
    // Demoted to fabricator: the experimenter token now exceeds the person's role and stops.
    expect((await bearer(second.token)('GET', `/api/labs/${lab.id}/designs`)).status).toBe(200)
    await pool.query('update memberships set role = $1 where user_id = $2 and lab_id = $3', [
      'fabricator',
      designer!.id,
      lab.id,
    ])
    expect((await bearer(second.token)('GET', `/api/labs/${lab.id}/designs`)).status).toBe(401)
    expect(
      (
        await new ApiClient()
          .signIn(designer!.email, TEST_PASSWORD)
          .then(c => c.delete(`/api/account/tokens/${'0'.repeat(8)}-0000-4000-8000-${'0'.repeat(12)}`))
      ).status,
    ).toBe(404)
  })

  it('runs the Python flow sweep of docs/examples/flow_sweep.py through a token, matching the signed-in answers', async () => {
    const {
      lab,
      people: [member],
    } = await makeLab(['experimenter'])
    const m = await as(member!.email)
    const { token } = (await m.post('/api/account/tokens', { name: 'flow sweep', labId: lab.id, role: 'experimenter' }))
      .json
    const flows = [2, 10, 40]
    // /usr/bin/python3 is Debian's (TOOLCHAIN.md); the script uses the standard library only.
    const { stdout } = await run('/usr/bin/python3', ['docs/examples/flow_sweep.py'], {
      env: { PATH: process.env.PATH, DW_URL: inject('baseURL'), DW_TOKEN: token, DW_FLOWS: flows.join(' ') },
      timeout: 60_000,
    })
    const [header, ...lines] = stdout
      .trim()
      .split(/\r?\n/)
      .map(l => l.split(','))
    expect(header).toEqual(['continuous_ul_min', 'regime', 'droplet_diameter_um', 'frequency_hz'])
    expect(lines).toHaveLength(flows.length)
    const request = JSON.parse(
      (await import('node:fs')).readFileSync('tests/fixtures/forecast/t-junction-request.json', 'utf8'),
    )
    for (const [i, flow] of flows.entries()) {
      const direct = await m.post('/api/v1/forecast', {
        ...request,
        flow: { continuous: `${flow} uL/min`, dispersed: '5 uL/min' },
      })
      expect(direct.status).toBe(200)
      const [f, regime, diameterUm] = lines[i]!
      expect(Number(f)).toBe(flow)
      expect(regime).toBe(direct.json.regime.value)
      expect(Number(diameterUm)).toBeCloseTo(direct.json.dropletDiameter.value * 1e6, 3)
    }
    const { rows } = await pool.query('select last_used_at from api_tokens where token_hash = $1', [
      createHash('sha256').update(token).digest('hex'),
    ])
    expect(rows[0].last_used_at).not.toBeNull()
  }, 90_000)

  it('serves the OpenAPI document without sign-in, generated from the schemas', async () => {
    const res = await fetch(`${inject('baseURL')}/api/v1/openapi.json`)
    expect(res.status).toBe(200)
    const doc = await res.json()
    expect(doc.openapi).toBe('3.1.0')
    expect(doc.paths['/api/v1/forecast'].post.requestBody.content['application/json'].schema.anyOf).toHaveLength(3)
    expect(doc.components.securitySchemes.bearer.scheme).toBe('bearer')
  })
})
