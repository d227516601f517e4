// Password policy on every form that sets one, change password, reset by e-mail link, sign out everywhere: over real
// HTTP against the built server, PostgreSQL and the local fake SMTP.
import { createHash, randomUUID } from 'node:crypto'
import pg from 'pg'
import { describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { invitationLink, resetLink, waitForMail } from '../support/mail'

async function sql(text: string, params: unknown[] = []) {
  const client = new pg.Client({ connectionString: inject('databaseUrl') })
  await client.connect()
  try {
    return (await client.query(text, params)).rows
  } finally {
    await client.end()
  }
}
const sha256 = (value: string) => createHash('sha256').update(value).digest('hex')
const as = (email: string, password = TEST_PASSWORD) => new ApiClient().signIn(email, password)
const person = async () => (await makeLab(['designer'])).people[0]!
const alive = async (api: ApiClient) => (await api.get('/api/auth/session')).status
const issue = (res: { json: any }, path: string) =>
  (res.json?.data?.issues as Array<{ path: string; message: string }> | undefined)?.find(i => i.path === path)?.message

async function askForReset(email: string) {
  return new ApiClient().post('/api/auth/password-reset', { email })
}

describe('password policy on every form that sets a password', () => {
  it('refuses a weak password when an invitation creates the account, and says what to do', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const email = `ines-${randomUUID().slice(0, 8)}@invited.example`
    expect(
      (await (await as(admin!.email)).post(`/api/labs/${lab.id}/invitations`, { email, role: 'reviewer' })).status,
    ).toBe(201)
    const { token } = invitationLink(await waitForMail(email))
    const visitor = new ApiClient()
    const tries: Array<[string, RegExp]> = [
      ['aaaaaaaaaa', /Do not repeat one character/],
      [email, /your e-mail address or your name/],
      [email.split('@')[0]!, /your e-mail address or your name/],
      ['Ines Varro', /your e-mail address or your name/],
      ['password123', /lists of common and leaked passwords: choose another/],
      ['qwertyuiop', /lists of common and leaked passwords/],
    ]
    for (const [password, message] of tries) {
      const res = await visitor.post(`/api/invitations/${token}/accept`, { name: 'Ines Varro', password })
      expect(res.status, password).toBe(400)
      expect(issue(res, 'password'), password).toMatch(message)
    }
    const ok = await visitor.post(`/api/invitations/${token}/accept`, {
      name: 'Ines Varro',
      password: 'marsh-violet-pipette',
    })
    expect(ok.status, JSON.stringify(ok.json)).toBe(200)
  })
})

describe('change password', () => {
  it('needs the current password, applies the policy, and ends every other session but this one', async () => {
    const someone = await person()
    const here = await as(someone.email)
    const phone = await as(someone.email)
    const laptop = await as(someone.email)

    const wrong = await here.post('/api/auth/password', {
      currentPassword: 'not-the-password',
      newPassword: 'marsh-violet-pipette',
    })
    expect(wrong.status).toBe(400)
    expect(issue(wrong, 'currentPassword')).toMatch(/Not your current password/)
    for (const [newPassword, message] of [
      ['1234567890', /common and leaked/],
      [someone.email, /your e-mail address/],
      ['zzzzzzzzzzzz', /Do not repeat/],
      ['short', /at least 10/],
    ] as const) {
      const res = await here.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword })
      expect(res.status, newPassword).toBe(400)
      expect(issue(res, 'newPassword'), newPassword).toMatch(message)
    }
    expect(await alive(phone)).toBe(200) // nothing changed so far

    const changed = await here.post('/api/auth/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'marsh-violet-pipette',
    })
    expect(changed.status, JSON.stringify(changed.json)).toBe(200)
    expect(changed.json).toEqual({ otherSessionsEnded: 2 })
    expect(await alive(here)).toBe(200)
    expect(await alive(phone)).toBe(401)
    expect(await alive(laptop)).toBe(401)
    expect(
      (await new ApiClient().post('/api/auth/login', { email: someone.email, password: TEST_PASSWORD })).status,
    ).toBe(401)
    await as(someone.email, 'marsh-violet-pipette')
  })

  it('is only for a signed-in person', async () => {
    const res = await new ApiClient().post('/api/auth/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'marsh-violet-pipette',
    })
    expect(res.status).toBe(401)
  })
})

describe('sign out everywhere', () => {
  it('ends every session of the person, this one included, and nobody else’s', async () => {
    const someone = await person()
    const other = await person()
    const sessions = await Promise.all([as(someone.email), as(someone.email), as(someone.email)])
    const bystander = await as(other.email)
    const res = await sessions[0]!.post('/api/auth/logout-everywhere')
    expect(res.status).toBe(200)
    expect(res.json).toEqual({ sessionsEnded: 3 })
    expect(sessions[0]!.cookies.has('dw_session')).toBe(false)
    for (const api of sessions) expect(await alive(api)).toBe(401)
    expect(await alive(bystander)).toBe(200)
    expect(
      await sql('select count(*)::int as n from sessions s join users u on u.id = s.user_id where u.email = $1', [
        someone.email,
      ]),
    ).toEqual([{ n: 0 }])
  })
})

describe('reset by e-mail link', () => {
  it('answers the same whether or not the address has an account, and mails only a real one', async () => {
    const someone = await person()
    const nobody = `nobody-${randomUUID().slice(0, 8)}@test.example`
    const [real, unknown] = [await askForReset(someone.email.toUpperCase()), await askForReset(nobody)]
    expect(real.status).toBe(200)
    expect(unknown.status).toBe(200)
    expect(unknown.json).toEqual(real.json)
    expect(real.json.message).toMatch(/If a Dropwright account uses that address/)
    const mail = await waitForMail(someone.email)
    expect(mail.subject).toBe('Reset your Dropwright password')
    expect(mail.text).toMatch(/works once and for 60 minutes/)
    const { token } = resetLink(mail)
    // Only the digest is stored.
    expect(await sql('select count(*)::int as n from password_resets where token_hash = $1', [token])).toEqual([
      { n: 0 },
    ])
    expect(await sql('select count(*)::int as n from password_resets where token_hash = $1', [sha256(token)])).toEqual([
      { n: 1 },
    ])
    expect(await sql('select count(*)::int as n from mail_outbox where "to" = $1', [nobody])).toEqual([{ n: 0 }])
    // A malformed address is a 400 that names the field (that says nothing about accounts).
    expect((await new ApiClient().post('/api/auth/password-reset', { email: 'not an address' })).status).toBe(400)
  })

  it('sets the password once, applies the policy, ends every session and signs the browser in; the link is then used up', async () => {
    const someone = await person()
    const before = await Promise.all([as(someone.email), as(someone.email)])
    await askForReset(someone.email)
    const { token } = resetLink(await waitForMail(someone.email))
    const visitor = new ApiClient()
    const info = await visitor.get(`/api/auth/password-reset/${token}`)
    expect(info.status).toBe(200)
    expect(info.json).toMatchObject({ email: someone.email, name: someone.name })

    const weak = await visitor.post(`/api/auth/password-reset/${token}`, { password: someone.email.split('@')[0] })
    expect(weak.status).toBe(400)
    expect(issue(weak, 'password')).toMatch(/your e-mail address or your name/)
    const common = await visitor.post(`/api/auth/password-reset/${token}`, { password: 'password1234' })
    expect(issue(common, 'password')).toMatch(/common and leaked/)
    for (const api of before) expect(await alive(api)).toBe(200) // a refused password changes nothing

    const done = await visitor.post(`/api/auth/password-reset/${token}`, { password: 'fennel-quartz-meniscus' })
    expect(done.status, JSON.stringify(done.json)).toBe(200)
    expect(done.json).toEqual({ sessionsEnded: 2 })
    for (const api of before) expect(await alive(api)).toBe(401)
    expect(await alive(visitor)).toBe(200)
    expect(
      (await new ApiClient().post('/api/auth/login', { email: someone.email, password: TEST_PASSWORD })).status,
    ).toBe(401)
    await as(someone.email, 'fennel-quartz-meniscus')

    const again = await new ApiClient().post(`/api/auth/password-reset/${token}`, { password: 'another-fine-password' })
    expect(again.status).toBe(410)
    expect(again.json.message).toMatch(/already been used/)
    expect((await new ApiClient().get(`/api/auth/password-reset/${token}`)).status).toBe(410)
  })

  it('expires after an hour', async () => {
    const someone = await person()
    await askForReset(someone.email)
    const { token } = resetLink(await waitForMail(someone.email))
    const [row] = await sql(
      `select extract(epoch from expires_at - created_at)::int as s from password_resets where token_hash = $1`,
      [sha256(token)],
    )
    expect(row.s).toBeGreaterThanOrEqual(3599)
    expect(row.s).toBeLessThanOrEqual(3601)
    await sql(`update password_resets set expires_at = now() - interval '1 second' where token_hash = $1`, [
      sha256(token),
    ])
    const late = await new ApiClient().post(`/api/auth/password-reset/${token}`, { password: 'fennel-quartz-meniscus' })
    expect(late.status).toBe(410)
    expect(late.json.message).toMatch(/expired/)
    await as(someone.email) // the old password still works
  })

  it('answers 404 to a link that never existed, and a changed password ends open links', async () => {
    expect((await new ApiClient().get(`/api/auth/password-reset/${'A'.repeat(43)}`)).status).toBe(404)
    const someone = await person()
    await askForReset(someone.email)
    const { token } = resetLink(await waitForMail(someone.email))
    const api = await as(someone.email)
    expect(
      (await api.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'marsh-violet-pipette' }))
        .status,
    ).toBe(200)
    expect(
      (await new ApiClient().post(`/api/auth/password-reset/${token}`, { password: 'fennel-quartz-meniscus' })).status,
    ).toBe(410)
  })

  it('sends at most three links an hour to one account, answering the same', async () => {
    const someone = await person()
    const answers = []
    for (let i = 0; i < 5; i++) answers.push(await askForReset(someone.email))
    expect(new Set(answers.map(a => JSON.stringify([a.status, a.json]))).size).toBe(1)
    expect(
      await sql(`select count(*)::int as n from mail_outbox where "to" = $1 and kind = 'password-reset'`, [
        someone.email,
      ]),
    ).toEqual([{ n: 3 }])
  })

  it('lets an owner locked out by strangers back in: the reset forgets the failures against the account', async () => {
    const someone = await person()
    const stranger = new ApiClient()
    for (let i = 0; i < 6; i++)
      await stranger.post('/api/auth/login', { email: someone.email, password: 'wrong-guess-000' })
    expect(
      (await new ApiClient().post('/api/auth/login', { email: someone.email, password: TEST_PASSWORD })).status,
    ).toBe(429)
    await askForReset(someone.email)
    const { token } = resetLink(await waitForMail(someone.email))
    expect(
      (await new ApiClient().post(`/api/auth/password-reset/${token}`, { password: 'fennel-quartz-meniscus' })).status,
    ).toBe(200)
    await as(someone.email, 'fennel-quartz-meniscus')
  })
})
