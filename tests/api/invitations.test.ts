import { randomUUID } from 'node:crypto'
import pg from 'pg'
import { describe, expect, inject, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { invitationLink, mailTo, waitForMail } from '../support/mail'

const as = (email: string) => new ApiClient().signIn(email, TEST_PASSWORD)
const fresh = (what = 'new') => `${what}-${randomUUID().slice(0, 8)}@invited.example`

async function sql(text: string, params: unknown[]) {
  const client = new pg.Client({ connectionString: inject('databaseUrl') })
  await client.connect()
  try {
    return (await client.query(text, params)).rows
  } finally {
    await client.end()
  }
}

async function invite(admin: ApiClient, labId: string, email: string, role = 'reviewer') {
  const res = await admin.post(`/api/labs/${labId}/invitations`, { email, role })
  expect(res.status, JSON.stringify(res.json)).toBe(201)
  return res.json as { id: string; email: string; role: string }
}

describe('invitations by e-mail (real server, real PostgreSQL, real SMTP)', () => {
  it('mails a link; accepting it with a new account signs the new person in with the invited role', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const a = await as(admin!.email)
    const email = fresh()
    const created = await invite(a, lab.id, email.toUpperCase(), 'reviewer')
    expect(created).toMatchObject({ email, role: 'reviewer', expired: false })
    expect(created).not.toHaveProperty('tokenHash')

    const mail = await waitForMail(email)
    expect(mail.subject).toContain(lab.name)
    expect(mail.text).toContain('Reviewer')
    const { path, token } = invitationLink(mail)
    expect(path).toBe(`/invitations/${token}`)
    // The table keeps only the digest, never the token in the link.
    expect(await sql('select 1 from invitations where token_hash = $1', [token])).toHaveLength(0)

    const visitor = new ApiClient()
    const info = await visitor.get(`/api/invitations/${token}`)
    expect(info.status).toBe(200)
    expect(info.json).toMatchObject({ labName: lab.name, role: 'reviewer', email, expired: false, hasAccount: false })

    const accepted = await visitor.post(`/api/invitations/${token}/accept`, {
      name: 'Ines Varro',
      password: 'a-long-enough-pass',
    })
    expect(accepted.status, JSON.stringify(accepted.json)).toBe(200)
    expect(accepted.json).toEqual({ labId: lab.id, role: 'reviewer', newAccount: true })
    const labs = await visitor.get('/api/labs')
    expect(labs.status).toBe(200)
    expect(labs.json).toEqual([expect.objectContaining({ labId: lab.id, role: 'reviewer' })])
    // The new account signs in with its own password later.
    await new ApiClient().signIn(email, 'a-long-enough-pass')
    // Used once: 410, and it no longer shows as pending.
    const again = await new ApiClient().post(`/api/invitations/${token}/accept`, {
      name: 'Someone',
      password: 'another-password',
    })
    expect(again.status).toBe(410)
    expect(again.json.message).toMatch(/already been used/)
    expect((await a.get(`/api/labs/${lab.id}/invitations`)).json).toEqual([])
  })

  it('lets a signed-in person with the invited address join; another address or a signed-out one must sign in first', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const {
      people: [outsider, other],
    } = await makeLab(['designer', 'designer'])
    const a = await as(admin!.email)
    await invite(a, lab.id, outsider!.email, 'designer')
    const { token } = invitationLink(await waitForMail(outsider!.email))

    const anonymous = await new ApiClient().post(`/api/invitations/${token}/accept`, {
      name: 'X',
      password: 'long-enough-1',
    })
    expect(anonymous.status).toBe(401)
    expect(anonymous.json.message).toMatch(/sign in as .* first/)
    expect((await new ApiClient().get(`/api/invitations/${token}`)).json.hasAccount).toBe(true)

    const wrong = await (await as(other!.email)).post(`/api/invitations/${token}/accept`, {})
    expect(wrong.status).toBe(403)
    expect(wrong.json.message).toContain(outsider!.email)

    const me = await as(outsider!.email)
    const joined = await me.post(`/api/invitations/${token}/accept`, {})
    expect(joined.status).toBe(200)
    expect(joined.json).toEqual({ labId: lab.id, role: 'designer', newAccount: false })
    expect((await me.get(`/api/labs/${lab.id}/members`)).status).toBe(200)
  })

  it('answers 410 for an expired link, with what to do', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const a = await as(admin!.email)
    const email = fresh('late')
    const created = await invite(a, lab.id, email)
    const { token } = invitationLink(await waitForMail(email))
    await sql(`update invitations set expires_at = now() - interval '1 hour' where id = $1`, [created.id])
    const info = await new ApiClient().get(`/api/invitations/${token}`)
    expect(info.json.expired).toBe(true)
    const res = await new ApiClient().post(`/api/invitations/${token}/accept`, {
      name: 'Late Comer',
      password: 'long-enough-1',
    })
    expect(res.status).toBe(410)
    expect(res.json.message).toMatch(/expired on \d{4}-\d\d-\d\d\. Ask an admin of .* to invite you again/)
    expect((await a.get(`/api/labs/${lab.id}/invitations`)).json[0]).toMatchObject({ id: created.id, expired: true })
  })

  it('forbids a role that may not manage members (403) and hides other labs (404)', async () => {
    const {
      lab,
      people: [admin, designer],
    } = await makeLab(['admin', 'designer'])
    const d = await as(designer!.email)
    expect((await d.post(`/api/labs/${lab.id}/invitations`, { email: fresh(), role: 'designer' })).status).toBe(403)
    expect((await d.get(`/api/labs/${lab.id}/invitations`)).status).toBe(403)
    const {
      lab: otherLab,
      people: [otherAdmin],
    } = await makeLab(['admin'])
    const o = await as(otherAdmin!.email)
    expect((await o.post(`/api/labs/${lab.id}/invitations`, { email: fresh(), role: 'designer' })).status).toBe(404)
    expect((await o.get(`/api/labs/${lab.id}/invitations`)).status).toBe(404)
    // Another lab's invitation cannot be revoked, through either address.
    const theirs = await invite(o, otherLab.id, fresh())
    const a = await as(admin!.email)
    expect((await a.delete(`/api/labs/${lab.id}/invitations/${theirs.id}`)).status).toBe(404)
    expect((await a.delete(`/api/labs/${otherLab.id}/invitations/${theirs.id}`)).status).toBe(404)
    expect((await o.get(`/api/labs/${otherLab.id}/invitations`)).json).toHaveLength(1)
  })

  it('rejects a bad e-mail or role with 400 naming the field, and an existing member with 409', async () => {
    const {
      lab,
      people: [admin, designer],
    } = await makeLab(['admin', 'designer'])
    const a = await as(admin!.email)
    const bad = await a.post(`/api/labs/${lab.id}/invitations`, { email: 'not-an-address', role: 'designer' })
    expect(bad.status).toBe(400)
    expect(bad.json.data.issues).toEqual([{ path: 'email', message: 'Enter an e-mail address' }])
    const role = await a.post(`/api/labs/${lab.id}/invitations`, { email: fresh(), role: 'owner' })
    expect(role.status).toBe(400)
    expect(role.json.data.issues[0].path).toBe('role')
    const member = await a.post(`/api/labs/${lab.id}/invitations`, { email: designer!.email, role: 'reviewer' })
    expect(member.status).toBe(409)
    expect(member.json.message).toMatch(/already a member/)
  })

  it('asks a new account for a name and a long enough password (400 naming the field)', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const a = await as(admin!.email)
    const email = fresh()
    await invite(a, lab.id, email)
    const { token } = invitationLink(await waitForMail(email))
    const res = await new ApiClient().post(`/api/invitations/${token}/accept`, { name: '', password: 'short' })
    expect(res.status).toBe(400)
    expect(res.json.data.issues.map((i: { path: string }) => i.path).sort()).toEqual(['name', 'password'])
  })

  it('lists pending invitations to admins; revoking one kills its link; inviting again replaces the old link', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const a = await as(admin!.email)
    const email = fresh()
    const first = await invite(a, lab.id, email, 'designer')
    const second = await invite(a, lab.id, email, 'experimenter')
    const list = await a.get(`/api/labs/${lab.id}/invitations`)
    expect(list.json).toEqual([
      expect.objectContaining({ id: second.id, email, role: 'experimenter', invitedByName: admin!.name }),
    ])
    await waitForMail(email, { index: 1 })
    const [oldMail, newMail] = mailTo(email)
    expect((await new ApiClient().get(`/api/invitations/${invitationLink(oldMail!).token}`)).status).toBe(404)
    expect((await a.delete(`/api/labs/${lab.id}/invitations/${first.id}`)).status).toBe(404)
    expect((await a.delete(`/api/labs/${lab.id}/invitations/${second.id}`)).status).toBe(204)
    const res = await new ApiClient().post(`/api/invitations/${invitationLink(newMail!).token}/accept`, {
      name: 'N',
      password: 'long-enough-1',
    })
    expect(res.status).toBe(404)
  })

  it('keeps everything else under /api/invitations behind sign-in', async () => {
    const anon = new ApiClient()
    expect((await anon.get('/api/invitations/short')).status).toBe(401)
    expect((await anon.get(`/api/invitations/${'a'.repeat(43)}/other`)).status).toBe(401)
    expect((await anon.request('DELETE', `/api/invitations/${'a'.repeat(43)}`)).status).toBe(401)
    expect((await anon.get(`/api/invitations/${'a'.repeat(43)}`)).status).toBe(404)
    const signed = await signedIn('designer@quillmere.example')
    const bad = await signed.get('/api/invitations/short')
    expect(bad.status).toBe(400)
    expect(bad.json.message).toMatch(/not valid/)
  })
})
