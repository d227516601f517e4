// Guarded state changes raced over real HTTP: release against a verdict, releases against each other, admins
// demoting each other, invitations to one address, fabrication status moves. A lost race answers 409 with what
// happened; the state that remains is always one the rules allow.
import { describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import pg from 'pg'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { labWithDesign } from '../support/designs'

const ROUNDS = 8

async function approvedRevision() {
  const setup = await labWithDesign()
  const base = `/api/labs/${setup.lab.id}/revisions/${setup.revisionId}`
  expect((await setup.as.designer.post(`${base}/review-requests`, { reviewerIds: [setup.ids.reviewer] })).status).toBe(
    200,
  )
  expect((await setup.as.reviewer.post(`${base}/verdicts`, { verdict: 'approve' })).status).toBe(200)
  return { ...setup, base }
}

async function sql<T extends pg.QueryResultRow>(text: string, values: unknown[]): Promise<T[]> {
  const client = new pg.Client({ connectionString: inject('databaseUrl') })
  await client.connect()
  try {
    return (await client.query<T>(text, values)).rows
  } finally {
    await client.end()
  }
}

describe('state machines under races (real server, real PostgreSQL)', () => {
  it(`a release racing "request changes" never leaves a changes-requested revision with a release (${ROUNDS} rounds)`, async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const { as, base, revisionId } = await approvedRevision()
      const [release, verdict] = await Promise.all([
        as.admin.post(`${base}/release`, { note: 'race' }),
        as.reviewer.post(`${base}/verdicts`, { verdict: 'request-changes', note: 'race' }),
      ])
      expect([release.status, verdict.status].sort(), JSON.stringify([release.json, verdict.json])).toEqual([200, 409])
      const state = (await as.designer.get(`${base}/review`)).json
      const rows = await sql('select 1 from releases where revision_id = $1', [revisionId])
      if (release.status === 200) {
        expect(state.status).toBe('released')
        expect(rows).toHaveLength(1)
        expect(verdict.json.message).toMatch(/released/)
      } else {
        expect(state.status).toBe('changes-requested')
        expect(rows).toHaveLength(0)
        expect(release.json.message).toMatch(/changes-requested/)
      }
    }
  }, 120_000)

  it('ten concurrent releases: one succeeds, nine answer 409 (never 500)', async () => {
    const { as, base, revisionId } = await approvedRevision()
    const answers = await Promise.all(Array.from({ length: 10 }, () => as.admin.post(`${base}/release`, {})))
    expect(answers.map(a => a.status).sort()).toEqual([200, ...Array(9).fill(409)])
    expect(answers.find(a => a.status === 409)!.json.message).toMatch(/already been released/)
    expect(await sql('select 1 from releases where revision_id = $1', [revisionId])).toHaveLength(1)
  })

  it(`two admins demoting each other leave the lab one admin (${ROUNDS} rounds)`, async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const {
        lab,
        people: [a, b],
      } = await makeLab(['admin', 'admin'])
      const [asA, asB] = await Promise.all([a!, b!].map(p => new ApiClient().signIn(p.email, TEST_PASSWORD)))
      const [ab, ba] = await Promise.all([
        asA!.patch(`/api/labs/${lab.id}/members/${b!.id}`, { role: 'designer' }),
        asB!.patch(`/api/labs/${lab.id}/members/${a!.id}`, { role: 'designer' }),
      ])
      // The loser is refused either inside the lab lock (409) or, when the winner committed before its session was
      // read, at the door because it is no longer an admin (403).
      const [won, lost] = [ab.status, ba.status].sort()
      expect(won, JSON.stringify([ab.json, ba.json])).toBe(200)
      expect([403, 409]).toContain(lost)
      const admins = await sql('select user_id from memberships where lab_id = $1 and role = $2', [lab.id, 'admin'])
      expect(admins).toHaveLength(1)
    }
  }, 120_000)

  it('an admin removed meanwhile cannot remove the last admin', async () => {
    const {
      lab,
      people: [a, b],
    } = await makeLab(['admin', 'admin'])
    const [asA, asB] = await Promise.all([a!, b!].map(p => new ApiClient().signIn(p.email, TEST_PASSWORD)))
    const [ab, ba] = await Promise.all([
      asA!.delete(`/api/labs/${lab.id}/members/${b!.id}`),
      asB!.delete(`/api/labs/${lab.id}/members/${a!.id}`),
    ])
    const [won, lost] = [ab.status, ba.status].sort()
    expect(won).toBe(204)
    expect([403, 404, 409]).toContain(lost) // refused inside the lock (409), or at the door once no longer an admin or member
    expect(await sql('select 1 from memberships where lab_id = $1 and role = $2', [lab.id, 'admin'])).toHaveLength(1)
  })

  it('ten concurrent invitations to one address leave one live link', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const api = await new ApiClient().signIn(admin!.email, TEST_PASSWORD)
    const email = `race-${lab.id.slice(0, 8)}@test.example`
    const answers = await Promise.all(
      Array.from({ length: 10 }, () => api.post(`/api/labs/${lab.id}/invitations`, { email, role: 'designer' })),
    )
    expect(answers.map(a => a.status)).toEqual(Array(10).fill(201))
    const open = await sql(
      'select 1 from invitations where lab_id = $1 and lower(email) = $2 and accepted_at is null',
      [lab.id, email],
    )
    expect(open).toHaveLength(1)
    expect(
      (await api.get(`/api/labs/${lab.id}/invitations`)).json.filter((i: { email: string }) => i.email === email),
    ).toHaveLength(1)
  })

  it('order status moves are guarded: of two racing moves one applies, and delivered is final', async () => {
    const { as, base } = await approvedRevision()
    const released = await as.admin.post(`${base}/release`, {})
    expect(released.status).toBe(200)
    const order = `${base.replace(/\/revisions\/.*/, '')}/orders/${released.json.orderId}/status`
    const move = (status: string, extra: Record<string, string> = {}) => as.fabricator.post(order, { status, ...extra })
    const [hold, start] = await Promise.all([move('on-hold', { note: 'waiting for wafers' }), move('in-fabrication')])
    expect([hold.status, start.status].sort()).toEqual([200, 200]) // received → on-hold → in-fabrication is allowed either way
    expect((await move('delivered')).status).toBe(409) // not shipped yet
    const shipped = await Promise.all(Array.from({ length: 5 }, () => move('shipped', { trackingNumber: 'TRK-1' })))
    const state = (await as.designer.get(`${base}/review`)).json.release.orderStatus
    // From in-fabrication exactly one of five "shipped" moves applies; from on-hold none may (it must restart first).
    expect(shipped.filter(s => s.status === 200)).toHaveLength(state === 'shipped' ? 1 : 0)
    if (state !== 'shipped') {
      expect(shipped[0]!.json.message).toMatch(/"On hold": it cannot move to "Shipped"/)
      expect((await move('in-fabrication')).status).toBe(200)
      expect((await move('shipped', { trackingNumber: 'TRK-1' })).status).toBe(200)
    } else {
      expect(shipped.find(s => s.status === 409)!.json.message).toMatch(/"Shipped": it cannot move to "Shipped"/)
    }
    expect((await move('delivered')).status).toBe(200)
    const final = await move('in-fabrication')
    expect(final.status).toBe(409)
    expect(final.json.message).toMatch(/delivered is final/)
  })
})
