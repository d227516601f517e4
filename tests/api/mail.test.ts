import { randomUUID } from 'node:crypto'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import { afterAll, describe, expect, inject, it } from 'vitest'
import * as schema from '../../server/db/schema'
import { mailNewComment, mailReleased, mailReviewRequested, mailVerdict } from '../../server/services/notifications'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { waitForMail } from '../support/mail'

const as = (email: string) => new ApiClient().signIn(email, TEST_PASSWORD)
const pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 2 })
const db = drizzle(pool, { schema })
afterAll(() => pool.end())

const outboxRow = async (to: string) => (await pool.query('select * from mail_outbox where "to" = $1', [to])).rows[0]

describe('e-mail through SMTP (real server, real fake SMTP)', () => {
  it('answers the request at once while the mail server refuses, then retries and delivers', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const a = await as(admin!.email)
    const email = `flaky-${randomUUID().slice(0, 8)}@invited.example` // the fake SMTP refuses these once (451)
    const started = Date.now()
    const res = await a.post(`/api/labs/${lab.id}/invitations`, { email, role: 'designer' })
    expect(res.status).toBe(201)
    expect(Date.now() - started).toBeLessThan(2000)
    await expect.poll(async () => (await outboxRow(email))?.attempts, { timeout: 5000 }).toBe(1)
    expect((await outboxRow(email)).last_error).toMatch(/451/)
    const mail = await waitForMail(email)
    expect(mail.subject).toContain(lab.name)
    await expect.poll(async () => (await outboxRow(email))?.sent_at, { timeout: 5000 }).not.toBeNull()
    expect((await outboxRow(email)).attempts).toBe(1)
  })

  it('sends the review notifications with every value in the HTML escaped', async () => {
    const { lab } = await makeLab(['admin'])
    const to = `notify-${randomUUID().slice(0, 8)}@test.example`
    const base = {
      labId: lab.id,
      to,
      designName: 'Cell loader <v2>',
      revisionNumber: 3,
      link: 'http://127.0.0.1/labs/x/designs/y',
    }
    await db.transaction(async tx => {
      await mailReviewRequested(tx, { ...base, requesterName: 'Tomas "T" Reyvik' })
      await mailNewComment(tx, { ...base, commenterName: 'Ines', excerpt: '<script>alert(1)</script> narrower here' })
      await mailVerdict(tx, { ...base, reviewerName: 'Ines', verdict: 'request-changes', note: 'Widen the oil inlet' })
      await mailReleased(tx, { ...base, releasedByName: 'Ada', labName: lab.name })
    })
    const arrived = await Promise.all([0, 1, 2, 3].map(index => waitForMail(to, { index })))
    expect(arrived.map(m => m.subject).sort()).toEqual([
      'Changes requested: "Cell loader <v2>" revision 3',
      'New comment on "Cell loader <v2>" revision 3',
      'Released for fabrication: "Cell loader <v2>" revision 3',
      'Review requested: "Cell loader <v2>" revision 3',
    ])
    const comment = arrived.find(m => m.subject.startsWith('New comment'))!
    expect(comment.text).toContain('<script>alert(1)</script> narrower here')
    expect(comment.html).not.toContain('<script>')
    expect(comment.html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;')
    expect(comment.text).toContain('Open the comment: http://127.0.0.1/labs/x/designs/y')
  })

  it("shows a lab's admins the messages of their lab only, in the development outbox", async () => {
    const {
      lab,
      people: [admin, designer],
    } = await makeLab(['admin', 'designer'])
    const {
      lab: other,
      people: [otherAdmin],
    } = await makeLab(['admin'])
    const a = await as(admin!.email)
    const o = await as(otherAdmin!.email)
    const ours = `ours-${randomUUID().slice(0, 8)}@invited.example`
    const theirs = `theirs-${randomUUID().slice(0, 8)}@invited.example`
    await a.post(`/api/labs/${lab.id}/invitations`, { email: ours, role: 'designer' })
    await o.post(`/api/labs/${other.id}/invitations`, { email: theirs, role: 'designer' })
    await waitForMail(ours)
    await waitForMail(theirs)
    expect((await a.get('/api/dev/outbox')).json).toEqual({ available: true })
    const box = await a.get(`/api/labs/${lab.id}/outbox`)
    expect(box.status).toBe(200)
    const recipients = box.json.messages.flatMap((m: { to: string[] }) => m.to)
    expect(recipients).toContain(ours)
    expect(recipients).not.toContain(theirs)
    expect(box.json.messages[0]).toMatchObject({ kind: 'invitation', subject: expect.stringContaining(lab.name) })
    expect((await (await as(designer!.email)).get(`/api/labs/${lab.id}/outbox`)).status).toBe(403)
    expect((await o.get(`/api/labs/${lab.id}/outbox`)).status).toBe(404)
    expect((await new ApiClient().get('/api/dev/outbox')).status).toBe(401)
  })
})
