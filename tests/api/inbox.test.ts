import { describe, expect, it } from 'vitest'
import { labWithDesign } from '../support/designs'

describe('lab overview: recent designs, waiting for my review, my open comments (real server, real PostgreSQL)', () => {
  it('lists per person what waits for them, and nothing of another lab', async () => {
    const { lab, as, ids, revisionId, designId } = await labWithDesign()
    const inbox = (who: keyof typeof as) => as[who].get(`/api/labs/${lab.id}/inbox`)
    const base = `/api/labs/${lab.id}/revisions/${revisionId}`

    let r = await inbox('reviewer')
    expect(r.status).toBe(200)
    expect(r.json.recentDesigns.map((d: { designId: string }) => d.designId)).toEqual([designId])
    expect(r.json.waitingForMe).toEqual([])

    expect((await as.designer.post(`${base}/review-requests`, { reviewerIds: [ids.reviewer] })).status).toBe(200)
    r = await inbox('reviewer')
    expect(r.json.waitingForMe).toEqual([
      expect.objectContaining({ revisionId, designId, designName: 'Cell drops T-junction', number: 1 }),
    ])
    expect((await inbox('admin')).json.waitingForMe).toEqual([]) // asked of the reviewer only

    const pin = await as.reviewer.post(`${base}/threads`, {
      anchor: { x: 5000, y: 3000, elementId: 'tj-1' },
      body: 'Narrower here?',
    })
    expect((await inbox('reviewer')).json.myOpenThreads.map((t: { threadId: string }) => t.threadId)).toEqual([
      pin.json.threadId,
    ])
    expect((await inbox('designer')).json.myOpenThreads).toEqual([]) // not written in yet
    await as.designer.post(`${base}/threads/${pin.json.threadId}/comments`, { body: 'Will do' })
    expect((await inbox('designer')).json.myOpenThreads).toHaveLength(1)

    await as.reviewer.post(`${base}/verdicts`, { verdict: 'request-changes', note: 'See the pin' })
    expect((await inbox('reviewer')).json.waitingForMe).toEqual([]) // answered
    await as.designer.patch(`${base}/threads/${pin.json.threadId}`, { resolved: true })
    expect((await inbox('reviewer')).json.myOpenThreads).toEqual([]) // resolved

    // A fabricator sees released work only: nothing here (their landing is the releases list).
    expect((await inbox('fabricator')).json).toEqual({ recentDesigns: [], waitingForMe: [], myOpenThreads: [] })
    // Another lab's id is 404, never 403.
    const other = await labWithDesign()
    expect((await other.as.reviewer.get(`/api/labs/${lab.id}/inbox`)).status).toBe(404)
  })
})
