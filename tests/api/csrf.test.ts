// Cross-site requests cannot change anything: a state-changing request whose Origin (or Referer) is another site,
// or that the browser marks `Sec-Fetch-Site: cross-site`, answers 403; bodies that are not JSON (what an HTML form
// can send: urlencoded, multipart, text/plain) answer 415. The same request from the app's own pages, or from a
// script that sends neither header, goes through. Links in e-mail never take their origin from the Host header.
import { randomUUID } from 'node:crypto'
import { request as httpRequest } from 'node:http'
import { beforeAll, describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { invitationLink, waitForMail } from '../support/mail'

const EVIL = 'https://evil.example'
const fresh = () => `csrf-${randomUUID().slice(0, 8)}@invited.example`

let admin: ApiClient
let labId = ''
let memberId = ''
let own = ''
let adminEmail = ''
beforeAll(async () => {
  const { lab, people } = await makeLab(['admin', 'reviewer'])
  labId = lab.id
  memberId = people[1]!.id
  adminEmail = people[0]!.email
  admin = await new ApiClient().signIn(adminEmail, TEST_PASSWORD)
  own = inject('baseURL')
})

const pending = async () =>
  ((await admin.get(`/api/labs/${labId}/invitations`)).json as Array<{ email: string }>).map(i => i.email)
const invite = (
  email: string,
  headers: Record<string, string>,
  body: string = JSON.stringify({ email, role: 'admin' }),
) =>
  admin.request('POST', `/api/labs/${labId}/invitations`, body, {
    headers: { 'content-type': 'application/json', ...headers },
  })

describe('CSRF: the origin of state-changing requests', () => {
  it('refuses a foreign Origin with 403 in plain words, and nothing is created', async () => {
    const email = fresh()
    const res = await invite(email, { origin: EVIL, 'sec-fetch-site': 'cross-site' })
    expect(res.status).toBe(403)
    expect(res.json.message).toMatch(/another site/)
    expect(await pending()).not.toContain(email)
    // Origin alone (an old browser that sends no Sec-Fetch-Site), and the opaque origin of a sandboxed frame.
    expect((await invite(email, { origin: EVIL })).status).toBe(403)
    expect((await invite(email, { origin: 'null' })).status).toBe(403)
    // A look-alike: same host, other port or scheme.
    expect((await invite(email, { origin: own.replace(/:(\d+)$/, (_, p) => `:${Number(p) + 1}`) })).status).toBe(403)
    expect((await invite(email, { origin: own.replace('http:', 'https:') })).status).toBe(403)
    expect(await pending()).not.toContain(email)
  })

  it('refuses a foreign Referer when there is no Origin', async () => {
    const email = fresh()
    expect((await invite(email, { referer: `${EVIL}/prize.html` })).status).toBe(403)
    expect(await pending()).not.toContain(email)
  })

  it('refuses Sec-Fetch-Site: cross-site even without Origin or Referer', async () => {
    const email = fresh()
    expect((await invite(email, { 'sec-fetch-site': 'cross-site' })).status).toBe(403)
    expect(await pending()).not.toContain(email)
  })

  it('refuses every kind of state change from another site: sign-out, role change, archive, withdraw', async () => {
    const design = await admin.post(`/api/labs/${labId}/designs`, { name: 'CSRF target' })
    expect(design.status).toBe(201)
    const created = await invite(fresh(), {})
    expect(created.status).toBe(201)
    const foreign = { origin: EVIL, 'sec-fetch-site': 'cross-site' }
    // Sign-out is tried on a second session of the same admin, so the checks below still have one.
    const victim = await new ApiClient().signIn(adminEmail, TEST_PASSWORD)
    expect((await victim.request('POST', '/api/auth/logout', undefined, { headers: foreign })).status).toBe(403)
    expect((await victim.get('/api/labs')).status).toBe(200)
    const attempts: Array<[string, string, unknown]> = [
      ['PATCH', `/api/labs/${labId}/members/${memberId}`, { role: 'admin' }],
      ['DELETE', `/api/labs/${labId}/invitations/${created.json.id}`, undefined],
      ['PATCH', `/api/labs/${labId}/designs/${design.json.designId}`, { archived: true }],
    ]
    for (const [method, path, body] of attempts) {
      const res = await admin.request(method, path, body, { headers: foreign })
      expect(res.status, `${method} ${path}`).toBe(403)
    }
    // Still signed in, the reviewer is still a reviewer, the invitation still pending.
    const members = await admin.get(`/api/labs/${labId}/members`)
    expect(members.status).toBe(200)
    expect((members.json as Array<{ userId: string; role: string }>).find(m => m.userId === memberId)?.role).toBe(
      'reviewer',
    )
    expect(await pending()).toContain(created.json.email)
    expect((await admin.get(`/api/labs/${labId}/designs/${design.json.designId}`)).json.design.archived).toBe(false)
  })

  it('lets reads through from anywhere (they change nothing)', async () => {
    expect(
      (
        await admin.request('GET', '/api/labs', undefined, {
          headers: { origin: EVIL, 'sec-fetch-site': 'cross-site' },
        })
      ).status,
    ).toBe(200)
  })

  it('accepts the same request from the app itself (Origin or Referer of its own address) and from scripts', async () => {
    const a = fresh()
    expect((await invite(a, { origin: own, 'sec-fetch-site': 'same-origin' })).status).toBe(201)
    const b = fresh()
    expect((await invite(b, { referer: `${own}/labs/${labId}/members` })).status).toBe(201)
    const c = fresh()
    expect((await invite(c, { 'content-type': 'application/json; charset=utf-8' })).status).toBe(201)
    expect(await pending()).toEqual(expect.arrayContaining([a, b, c]))
  })
})

describe('CSRF: only JSON bodies', () => {
  const sameOrigin = () => ({ origin: own, 'sec-fetch-site': 'same-origin' })

  it('refuses what an HTML form can send (urlencoded, multipart, text/plain) with 415 naming application/json', async () => {
    const email = fresh()
    const boundary = '----dwform'
    const forms: Array<[string, string]> = [
      ['application/x-www-form-urlencoded', `email=${encodeURIComponent(email)}&role=admin`],
      [
        `multipart/form-data; boundary=${boundary}`,
        `--${boundary}\r\nContent-Disposition: form-data; name="email"\r\n\r\n${email}\r\n--${boundary}--\r\n`,
      ],
      ['text/plain', JSON.stringify({ email, role: 'admin' })],
    ]
    for (const [type, body] of forms) {
      const res = await invite(email, { ...sameOrigin(), 'content-type': type }, body)
      expect(res.status, type).toBe(415)
      expect(res.json.message).toMatch(/application\/json/)
      expect(res.json.message).toContain(type.split(';')[0])
    }
    expect(await pending()).not.toContain(email)
  })

  it('does not parse JSON sent as multipart/form-data', async () => {
    const email = fresh()
    const res = await invite(email, { ...sameOrigin(), 'content-type': 'multipart/form-data; boundary=x' })
    expect(res.status).toBe(415)
    expect(await pending()).not.toContain(email)
    // The sign-in route too (a public route).
    const login = await new ApiClient().request(
      'POST',
      '/api/auth/login',
      JSON.stringify({ email: 'admin@quillmere.example', password: 'drop-demo-2026' }),
      { headers: { 'content-type': 'multipart/form-data; boundary=x' } },
    )
    expect(login.status).toBe(415)
  })

  it('accepts a bodiless write without a content type (sign-out, delete) but not one with a form type', async () => {
    const created = await invite(fresh(), {})
    const form = await admin.request('DELETE', `/api/labs/${labId}/invitations/${created.json.id}`, '', {
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    })
    expect(form.status).toBe(415)
    const plain = await admin.request('DELETE', `/api/labs/${labId}/invitations/${created.json.id}`, undefined, {
      headers: sameOrigin(),
    })
    expect(plain.status).toBe(204)
  })
})

describe('link origin: never the Host header', () => {
  it('an invitation created with a forged Host header carries the configured address', async () => {
    const email = fresh()
    const url = new URL(`/api/labs/${labId}/invitations`, own)
    const cookie = [...admin.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
    const status = await new Promise<number>((resolve, reject) => {
      const req = httpRequest(
        url,
        { method: 'POST', headers: { host: 'evil.example', 'content-type': 'application/json', cookie } },
        res => {
          res.resume()
          res.on('end', () => resolve(res.statusCode!))
        },
      )
      req.on('error', reject)
      req.end(JSON.stringify({ email, role: 'reviewer' }))
    })
    expect(status).toBe(201)
    const link = invitationLink(await waitForMail(email))
    expect(new URL(link.url).origin).toBe(own)
    expect(link.url).not.toContain('evil.example')
  })
})
