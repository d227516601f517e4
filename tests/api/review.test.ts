import { describe, expect, it } from 'vitest'
import { labWithDesign } from '../support/designs'

describe("review, release and the fabricator's view (real server, real PostgreSQL)", () => {
  it('walks draft → in review → changes requested → approved → released, with who and when', async () => {
    const { lab, as, ids, revisionId, designId } = await labWithDesign()
    const base = `/api/labs/${lab.id}/revisions/${revisionId}`
    expect((await as.reviewer.post(`${base}/verdicts`, { verdict: 'approve' })).status).toBe(409) // nobody asked yet
    expect((await as.designer.post(`${base}/review-requests`, { reviewerIds: [ids.reviewer] })).status).toBe(200)
    let state = (await as.designer.get(`${base}/review`)).json
    expect(state.status).toBe('in-review')
    expect(state.requests.map((r: { reviewerId: string }) => r.reviewerId)).toEqual([ids.reviewer])

    const pin = await as.reviewer.post(`${base}/threads`, {
      anchor: { x: 5000, y: 3000, elementId: 'tj-1' },
      body: 'This junction, **narrower**?',
    })
    expect(pin.status).toBe(201)
    await as.reviewer.post(`${base}/threads`, { anchor: { x: 1500, y: 3000 }, body: 'Punch closer to the edge?' })
    expect(
      (await as.reviewer.post(`${base}/verdicts`, { verdict: 'request-changes', note: 'See pins' })).json.status,
    ).toBe('changes-requested')
    expect(
      (await as.designer.post(`${base}/threads/${pin.json.threadId}/comments`, { body: 'Done in the next revision' }))
        .status,
    ).toBe(201)
    expect((await as.designer.patch(`${base}/threads/${pin.json.threadId}`, { resolved: true })).status).toBe(200)
    expect((await as.admin.post(`${base}/release`, {})).status).toBe(409) // not approved yet
    expect((await as.reviewer.post(`${base}/verdicts`, { verdict: 'approve' })).json.status).toBe('approved')

    state = (await as.designer.get(`${base}/review`)).json
    expect(state.threads).toHaveLength(2)
    expect(state.threads[0]).toMatchObject({
      anchor: { x: 5000, y: 3000, elementId: 'tj-1' },
      resolvedBy: expect.stringMatching(/designer/),
    })
    expect(state.threads[0].comments.map((c: { body: string }) => c.body)).toEqual([
      'This junction, **narrower**?',
      'Done in the next revision',
    ])
    expect(state.verdicts).toEqual([expect.objectContaining({ reviewerId: ids.reviewer, verdict: 'approve' })])
    expect(state.statusChangedBy).toMatch(/reviewer/)

    expect((await as.designer.post(`${base}/release`, {})).status).toBe(403) // only an admin releases
    expect((await as.admin.post(`${base}/release`, { note: 'Two wafers please' })).json.status).toBe('released')
    expect((await as.reviewer.post(`${base}/verdicts`, { verdict: 'request-changes' })).status).toBe(409) // final

    const activity = (await as.experimenter.get(`/api/labs/${lab.id}/designs/${designId}`)).json.activity.map(
      (a: { action: string }) => a.action,
    )
    expect(activity).toEqual(
      expect.arrayContaining([
        'review.requested',
        'comment.pinned',
        'review.changes-requested',
        'comment.resolved',
        'review.approved',
        'revision.released',
      ]),
    )
  })

  it('shows the fabricator only released revisions, their DXF and nothing else', async () => {
    const { lab, as, ids, revisionId, designId } = await labWithDesign()
    const base = `/api/labs/${lab.id}/revisions/${revisionId}`
    expect((await as.fabricator.get(base)).status).toBe(404)
    expect((await as.fabricator.get(`${base}/dxf`)).status).toBe(404)
    expect((await as.fabricator.get(`/api/labs/${lab.id}/designs`)).status).toBe(403)
    expect((await as.fabricator.get(`/api/labs/${lab.id}/designs/${designId}`)).status).toBe(403)
    await as.designer.post(`${base}/review-requests`, { reviewerIds: [ids.reviewer] })
    await as.reviewer.post(`${base}/verdicts`, { verdict: 'approve' })
    await as.admin.post(`${base}/release`, {})
    const released = await as.fabricator.get(`/api/labs/${lab.id}/releases`)
    expect(released.json.map((r: { revisionId: string }) => r.revisionId)).toEqual([revisionId])
    expect((await as.fabricator.get(base)).status).toBe(200)
    const seen = (await as.fabricator.get(`${base}/review`)).json
    expect(seen).toMatchObject({ status: 'released', threads: [], verdicts: [], reviewers: [] })
    const dxf = await as.fabricator.get(`${base}/dxf?mirror=true`)
    expect(dxf.status).toBe(200)
    expect(dxf.headers.get('content-disposition')).toMatch(/cell-drops-t-junction_r1_all-layers_mirrored\.dxf/)
    expect(String(dxf.json)).toContain('$INSUNITS')
    const orderId = seen.release.orderId as string
    const orderPath = `/api/labs/${lab.id}/orders/${orderId}`
    expect((await as.fabricator.post(`${orderPath}/status`, { status: 'in-fabrication' })).json.status).toBe(
      'in-fabrication',
    )
    expect((await as.designer.post(`${orderPath}/status`, { status: 'shipped', trackingNumber: 'T1' })).status).toBe(
      403,
    )
    expect((await as.fabricator.get(`${base}/review`)).json.release.orderStatus).toBe('in-fabrication')
    expect((await as.fabricator.post(`${base}/threads`, { anchor: { x: 0, y: 0 }, body: 'hi' })).status).toBe(403)
  })

  it('validates comments and pins, and keeps markup as inert text', async () => {
    const { lab, as, revisionId } = await labWithDesign()
    const base = `/api/labs/${lab.id}/revisions/${revisionId}`
    const bad = await as.reviewer.post(`${base}/threads`, { anchor: { x: 'left', y: 1 }, body: '' })
    expect(bad.status).toBe(400)
    expect(bad.json.data.issues.map((i: { path: string }) => i.path).sort()).toEqual(['anchor.x', 'body'])
    const script = '<script>alert(1)</script><img src=x onerror=alert(2)>'
    await as.reviewer.post(`${base}/threads`, { anchor: { x: 1, y: 2 }, body: script })
    const state = (await as.reviewer.get(`${base}/review`)).json
    expect(state.threads[0].comments[0].body).toBe(script) // stored as typed; rendered sanitised (browser test)
    expect((await as.reviewer.post(`${base}/review-requests`, { reviewerIds: [] })).status).toBe(403)
  })

  it('only requests review from people in the lab who may approve', async () => {
    const { lab, as, ids, revisionId } = await labWithDesign()
    const res = await as.designer.post(`/api/labs/${lab.id}/revisions/${revisionId}/review-requests`, {
      reviewerIds: [ids.fabricator],
    })
    expect(res.status).toBe(400)
    expect(res.json.data.issues[0].path).toBe('reviewerIds')
  })
})
