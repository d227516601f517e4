// An archived design is read-only: no comments, thread changes, review requests, verdicts, releases, saves or
// mask downloads on its revisions (409 "restore it first"); it can still be read, and restored. Who may archive
// follows the permission table: admins and designers any design, an experimenter only one they created.
import { beforeAll, describe, expect, it } from 'vitest'
import { fixtureDocument } from '../support/factory'
import { labWithDesign } from '../support/designs'

type Ctx = Awaited<ReturnType<typeof labWithDesign>>
let ctx: Ctx
let rev: string
let design: string
let threadId: string

beforeAll(async () => {
  ctx = await labWithDesign()
  rev = `/api/labs/${ctx.lab.id}/revisions/${ctx.revisionId}`
  design = `/api/labs/${ctx.lab.id}/designs/${ctx.designId}`
  const thread = await ctx.as.designer.post(`${rev}/threads`, { anchor: { x: 10, y: 20 }, body: 'before archiving' })
  expect(thread.status).toBe(201)
  threadId = thread.json.threadId
  // Approved, so that a release, a new verdict and a new review request would all be allowed if it were not archived.
  expect((await ctx.as.designer.post(`${rev}/review-requests`, { reviewerIds: [ctx.ids.reviewer] })).status).toBe(200)
  expect((await ctx.as.reviewer.post(`${rev}/verdicts`, { verdict: 'approve' })).status).toBe(200)
  expect((await ctx.as.designer.patch(design, { archived: true })).status).toBe(200)
}, 120_000)

describe('an archived design is read-only', () => {
  const refused = () =>
    [
      ['pin a comment', ctx.as.designer.post(`${rev}/threads`, { anchor: { x: 1, y: 1 }, body: 'after' })],
      ['reply', ctx.as.designer.post(`${rev}/threads/${threadId}/comments`, { body: 'after' })],
      ['resolve a thread', ctx.as.designer.patch(`${rev}/threads/${threadId}`, { resolved: true })],
      ['request review', ctx.as.designer.post(`${rev}/review-requests`, { reviewerIds: [ctx.ids.reviewer] })],
      ['verdict', ctx.as.reviewer.post(`${rev}/verdicts`, { verdict: 'request-changes', note: 'late' })],
      ['release', ctx.as.admin.post(`${rev}/release`, { note: 'late' })],
      ['DXF download', ctx.as.designer.get(`${rev}/dxf`)],
      [
        'save a revision',
        ctx.as.designer.post(`${design}/revisions`, {
          parentId: ctx.revisionId,
          message: 'late',
          document: fixtureDocument(),
        }),
      ],
      ['rename', ctx.as.designer.patch(design, { name: 'Renamed while archived' })],
    ] as const

  it('refuses every change and the mask download with 409 saying to restore it first', async () => {
    for (const [what, pending] of refused()) {
      const res = await pending
      expect(res.status, `${what}: ${JSON.stringify(res.json)}`).toBe(409)
      expect(res.json.message, what).toMatch(/archived: restore it/)
    }
    const state = (await ctx.as.designer.get(`${rev}/review`)).json
    expect(state.status).toBe('approved')
    expect(state.threads).toHaveLength(1)
    expect(state.threads[0].comments).toHaveLength(1)
    expect(state.threads[0].resolvedAt).toBeNull()
  })

  it('can still be read (the design, the revision, its review) and duplicated into a new design', async () => {
    expect((await ctx.as.designer.get(design)).json.design.archived).toBe(true)
    expect((await ctx.as.designer.get(rev)).status).toBe(200)
    expect((await ctx.as.reviewer.get(`${rev}/review`)).status).toBe(200)
    // A duplicate changes nothing on the archived design: reviving an old design that worked is what it is for.
    const copy = await ctx.as.experimenter.post(`${rev}/duplicate`, { targetLabId: ctx.lab.id, name: 'Revived copy' })
    expect(copy.status, JSON.stringify(copy.json)).toBeLessThan(300)
    expect(
      (await ctx.as.experimenter.get(`/api/labs/${ctx.lab.id}/designs/${copy.json.designId}`)).json.design.archived,
    ).toBe(false)
  })

  it('takes comments and serves its DXF again once restored', async () => {
    expect((await ctx.as.designer.patch(design, { archived: false })).status).toBe(200)
    expect((await ctx.as.designer.post(`${rev}/threads/${threadId}/comments`, { body: 'restored' })).status).toBe(201)
    expect((await ctx.as.designer.get(`${rev}/dxf`)).status).toBe(200)
    expect((await ctx.as.designer.patch(design, { archived: true })).status).toBe(200)
    expect((await ctx.as.designer.patch(design, { name: 'Restored and renamed', archived: false })).status).toBe(200)
  })
})

describe('who may archive', () => {
  it("an experimenter may archive and restore a design they created, not anyone else's", async () => {
    const { as, lab, designId } = await labWithDesign() // created by the designer
    const others = `/api/labs/${lab.id}/designs/${designId}`
    const denied = await as.experimenter.patch(others, { archived: true })
    expect(denied.status).toBe(403)
    expect(denied.json.message).toMatch(/only designs you created/)
    expect((await as.experimenter.get(others)).json.design.archived).toBe(false)
    // Renaming stays with designs:edit.
    expect((await as.experimenter.patch(others, { name: 'Renamed by the experimenter' })).status).toBe(200)

    const mine = await as.experimenter.post(`/api/labs/${lab.id}/designs`, {
      name: 'Bench copy',
      document: fixtureDocument(),
    })
    expect(mine.status).toBe(201)
    const own = `/api/labs/${lab.id}/designs/${mine.json.designId}`
    expect((await as.experimenter.patch(own, { archived: true })).status).toBe(200)
    expect((await as.experimenter.patch(own, { archived: false })).status).toBe(200)
    // A designer and an admin may archive anyone's; a reviewer no one's.
    expect((await as.designer.patch(own, { archived: true })).status).toBe(200)
    expect((await as.admin.patch(own, { archived: false })).status).toBe(200)
    expect((await as.reviewer.patch(own, { archived: true })).status).toBe(403)
  })

  it("the design detail names its creator's id, which the page's archive button checks with canArchive", async () => {
    const { as, lab, designId, ids } = await labWithDesign()
    const detail = (await as.experimenter.get(`/api/labs/${lab.id}/designs/${designId}`)).json
    expect(detail.design.createdById).toBe(ids.designer)
  })
})
