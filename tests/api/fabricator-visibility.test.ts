// A fabrication partner sees released revisions only — and nothing about the others: no answer they can get, on
// any route, names an unreleased revision (its parent, the design's newer latest, a thread on a draft).
import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { fixtureDocument } from '../support/factory'
import { labWithDesign } from '../support/designs'
import { apiRoutes, fill } from '../support/routes'

type Ctx = Awaited<ReturnType<typeof labWithDesign>>
let ctx: Ctx
let released: string
let unreleased: string[]
let threadId: string
let orderId: string

async function save(parentId: string, message: string) {
  const res = await ctx.as.designer.post(`/api/labs/${ctx.lab.id}/designs/${ctx.designId}/revisions`, {
    parentId,
    message,
    document: fixtureDocument(),
  })
  expect(res.status, JSON.stringify(res.json)).toBe(201)
  return res.json.revisionId as string
}

beforeAll(async () => {
  ctx = await labWithDesign()
  const r1 = ctx.revisionId
  released = await save(r1, 'for the mask')
  const base = `/api/labs/${ctx.lab.id}/revisions/${released}`
  expect((await ctx.as.designer.post(`${base}/review-requests`, { reviewerIds: [ctx.ids.reviewer] })).status).toBe(200)
  expect((await ctx.as.reviewer.post(`${base}/verdicts`, { verdict: 'approve' })).status).toBe(200)
  const release = await ctx.as.admin.post(`${base}/release`, { note: 'go' })
  expect(release.status).toBe(200)
  orderId = release.json.orderId
  const r3 = await save(released, 'after the release') // the design's latest, unreleased
  const thread = await ctx.as.designer.post(`/api/labs/${ctx.lab.id}/revisions/${r1}/threads`, {
    anchor: { x: 1, y: 1 },
    body: 'draft note',
  })
  expect(thread.status).toBe(201)
  threadId = thread.json.threadId
  unreleased = [r1, r3]
}, 120_000)

const WRITE_BODIES: Record<string, unknown> = {
  'POST /api/labs/[labId]/orders/[orderId]/status': { status: 'in-fabrication', note: 'started' },
  'POST /api/labs/[labId]/orders/[orderId]/messages': { body: 'started' },
}
// Signing in and out change the session, not what a revision says.
// Routes that end the walker's own session (it would walk the rest signed out).
const SKIP = new Set(['POST /api/auth/login', 'POST /api/auth/logout', 'POST /api/auth/logout-everywhere'])

describe("a fabricator's answers carry nothing about unreleased revisions", () => {
  it('the released revision names neither its unreleased parent nor the unreleased latest; insiders still see both', async () => {
    const path = `/api/labs/${ctx.lab.id}/revisions/${released}`
    const outside = await ctx.as.fabricator.get(path)
    expect(outside.status).toBe(200)
    expect(outside.json).toMatchObject({ id: released, parentId: null, latestRevisionId: null })
    const inside = await ctx.as.designer.get(path)
    expect(inside.json).toMatchObject({ id: released, parentId: unreleased[0], latestRevisionId: unreleased[1] })
  })

  it('walking every route with every revision id, no answer body contains an unreleased revision id', async () => {
    const answers: string[] = []
    const seen: Record<string, number> = {}
    for (const route of apiRoutes()) {
      const key = `${route.method} ${route.template}`
      if (SKIP.has(key)) continue
      for (const revisionId of [released, ...unreleased]) {
        const path = fill(route.template, {
          labId: ctx.lab.id,
          designId: ctx.designId,
          revisionId,
          threadId,
          userId: ctx.ids.fabricator,
          invitationId: randomUUID(),
          token: 'not-a-token',
          tokenId: randomUUID(),
          runId: randomUUID(),
          micrographId: randomUUID(),
          orderId,
          asBuiltId: randomUUID(),
          fileId: randomUUID(),
          entryId: randomUUID(),
          exportId: randomUUID(),
        })
        const res = await ctx.as.fabricator.request(
          route.method,
          path,
          route.method === 'GET' ? undefined : (WRITE_BODIES[key] ?? {}),
        )
        // An error answer repeats the address the fabricator sent: an id they typed themselves is not a leak.
        const text = (typeof res.json === 'string' ? res.json : JSON.stringify(res.json)).replaceAll(path, '<address>')
        for (const id of unreleased) {
          expect(
            text.includes(id),
            `${key} (${revisionId === released ? 'released' : 'unreleased'} revision) answered ${res.status} naming unreleased revision ${id}: ${text.slice(0, 400)}`,
          ).toBe(false)
        }
        seen[`${res.status}`] = (seen[`${res.status}`] ?? 0) + 1
        if (revisionId === released && res.status < 300) answers.push(key)
        if (!route.template.includes('[revisionId]')) break
      }
    }
    // The walk reached what a fabricator may read and do, so the check above looked at real answers.
    expect(answers).toEqual(
      expect.arrayContaining([
        'GET /api/labs/[labId]/releases',
        'GET /api/labs/[labId]/revisions/[revisionId]',
        'GET /api/labs/[labId]/revisions/[revisionId]/review',
        'GET /api/labs/[labId]/revisions/[revisionId]/dxf',
        'GET /api/labs/[labId]/orders',
        'GET /api/labs/[labId]/orders/[orderId]',
        'POST /api/labs/[labId]/orders/[orderId]/status',
        'GET /api/labs',
      ]),
    )
    expect(
      Object.keys(seen).filter(s => Number(s) >= 500),
      JSON.stringify(seen),
    ).toEqual([])
  }, 60_000)
})
