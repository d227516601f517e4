import { describe, expect, it } from 'vitest'
import { fixtureDocument } from '../support/factory'
import { labWithDesign } from '../support/designs'

describe('designs and revisions (real server, real PostgreSQL)', () => {
  it('creates a design with its first revision and lists it with kinds, status and author', async () => {
    const { lab, as, designId } = await labWithDesign()
    const list = await as.reviewer.get(`/api/labs/${lab.id}/designs`)
    expect(list.status).toBe(200)
    const row = list.json.find((d: { id: string }) => d.id === designId)
    expect(row).toMatchObject({
      name: 'Cell drops T-junction',
      latestNumber: 1,
      status: 'draft',
      junctionKinds: ['t-junction'],
    })
    expect(row.authorName).toMatch(/designer/)
  })

  it('searches, filters and sorts', async () => {
    const { lab, as } = await labWithDesign()
    await as.designer.post(`/api/labs/${lab.id}/designs`, { name: 'Another chip (starter)' })
    const search = await as.designer.get(`/api/labs/${lab.id}/designs?q=starter`)
    expect(search.json.map((d: { name: string }) => d.name)).toEqual(['Another chip (starter)'])
    const byName = await as.designer.get(`/api/labs/${lab.id}/designs?sort=name&dir=asc`)
    expect(byName.json.map((d: { name: string }) => d.name)).toEqual([
      'Another chip (starter)',
      'Cell drops T-junction',
    ])
    const kind = await as.designer.get(`/api/labs/${lab.id}/designs?kind=step-array`)
    expect(kind.json).toEqual([])
    const bad = await as.designer.get(`/api/labs/${lab.id}/designs?sort=colour`)
    expect(bad.status).toBe(400)
    expect(bad.json.data.issues[0].path).toBe('sort')
  })

  it('saves revisions as new rows and answers 409 with what changed for a stale parent', async () => {
    const { lab, as, designId, revisionId } = await labWithDesign()
    const doc = fixtureDocument()
    doc.components[0].mainWidth = 90
    const r2 = await as.designer.post(`/api/labs/${lab.id}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: 'Narrower main channel',
      document: doc,
    })
    expect(r2.status).toBe(201)
    expect(r2.json.number).toBe(2)
    const stale = await as.admin.post(`/api/labs/${lab.id}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: 'My edit of r1',
      document: fixtureDocument(),
    })
    expect(stale.status).toBe(409)
    expect(stale.json.message).toMatch(/r2 by .*Narrower main channel/)
    expect(stale.json.data.since.map((r: { number: number }) => r.number)).toEqual([2])
    const branch = await as.admin.post(`/api/labs/${lab.id}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: 'My edit of r1',
      document: fixtureDocument(),
      branch: true,
    })
    expect(branch.status).toBe(201)
    expect(branch.json.number).toBe(3)
    const revs = await as.reviewer.get(`/api/labs/${lab.id}/designs/${designId}/revisions`)
    expect(revs.json.map((r: { number: number; parentId: string | null }) => [r.number, r.parentId])).toEqual([
      [1, null],
      [2, revisionId],
      [3, revisionId],
    ])
    const first = await as.reviewer.get(`/api/labs/${lab.id}/revisions/${revisionId}`)
    expect(first.json.document.components[0].mainWidth).toBe(100) // r1 never changed
  })

  it('rejects an invalid document with 400 naming the element, and an oversized one with 413', async () => {
    const { lab, as, designId, revisionId } = await labWithDesign()
    const doc = fixtureDocument()
    doc.channels[1].width = -3
    const res = await as.designer.post(`/api/labs/${lab.id}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: 'oops',
      document: doc,
    })
    expect(res.status).toBe(400)
    expect(res.json.message).toContain('water-feed')
    expect(res.json.data.issues[0].path).toMatch(/^document\.channels/)
    const huge = JSON.stringify({
      parentId: revisionId,
      message: 'big',
      document: { ...doc, name: 'x'.repeat(9 * 1024 * 1024) },
    })
    expect((await as.designer.request('POST', `/api/labs/${lab.id}/designs/${designId}/revisions`, huge)).status).toBe(
      413,
    )
    const missing = await as.designer.post(`/api/labs/${lab.id}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: '',
    })
    expect(missing.status).toBe(400)
    expect(missing.json.data.issues.map((i: { path: string }) => i.path).sort()).toEqual(['document', 'message'])
  })

  it('loses no revision when 50 saves race on the same parent: exactly one wins each race', async () => {
    const { lab, as, designId } = await labWithDesign()
    let parent = (await as.designer.get(`/api/labs/${lab.id}/designs/${designId}`)).json.design.latestRevisionId
    const doc = fixtureDocument()
    for (let race = 0; race < 50; race++) {
      const [a, b] = await Promise.all(
        [as.designer, as.admin].map((api, i) =>
          api.post(`/api/labs/${lab.id}/designs/${designId}/revisions`, {
            parentId: parent,
            message: `race ${race} by ${i}`,
            document: doc,
          }),
        ),
      )
      expect([a!.status, b!.status].sort()).toEqual([201, 409])
      parent = (a!.status === 201 ? a! : b!).json.revisionId
    }
    const revs = await as.designer.get(`/api/labs/${lab.id}/designs/${designId}/revisions`)
    expect(revs.json.map((r: { number: number }) => r.number)).toEqual(Array.from({ length: 51 }, (_, i) => i + 1))
  }, 120_000)

  it('archives and restores a design; archived designs leave the default list and refuse saves', async () => {
    const { lab, as, designId, revisionId } = await labWithDesign()
    expect((await as.designer.patch(`/api/labs/${lab.id}/designs/${designId}`, { archived: true })).status).toBe(200)
    expect((await as.designer.get(`/api/labs/${lab.id}/designs`)).json.map((d: { id: string }) => d.id)).not.toContain(
      designId,
    )
    expect(
      (await as.designer.get(`/api/labs/${lab.id}/designs?archived=true`)).json.map((d: { id: string }) => d.id),
    ).toContain(designId)
    expect(
      (
        await as.designer.post(`/api/labs/${lab.id}/designs/${designId}/revisions`, {
          parentId: revisionId,
          message: 'x',
          document: fixtureDocument(),
        })
      ).status,
    ).toBe(409)
    await as.designer.patch(`/api/labs/${lab.id}/designs/${designId}`, { archived: false })
    const detail = await as.designer.get(`/api/labs/${lab.id}/designs/${designId}`)
    expect(detail.json.activity.map((a: { action: string }) => a.action)).toEqual([
      'design.restored',
      'design.archived',
      'design.created',
    ])
  })

  it('duplicates a revision into another lab with its origin recorded', async () => {
    const { lab, as, revisionId } = await labWithDesign()
    const other = await labWithDesign()
    // the designer of lab 1 is not in lab 2: 404
    expect(
      (
        await as.designer.post(`/api/labs/${lab.id}/revisions/${revisionId}/duplicate`, {
          targetLabId: other.lab.id,
          name: 'Copy',
        })
      ).status,
    ).toBe(404)
    const copy = await as.designer.post(`/api/labs/${lab.id}/revisions/${revisionId}/duplicate`, {
      targetLabId: lab.id,
      name: 'Copy that worked',
    })
    expect(copy.status).toBe(201)
    const detail = await as.experimenter.get(`/api/labs/${lab.id}/designs/${copy.json.designId}`)
    expect(detail.json.design.origin).toMatchObject({
      revisionId,
      designName: 'Cell drops T-junction',
      revisionNumber: 1,
    })
    // a reviewer may read but not create designs
    expect(
      (
        await as.reviewer.post(`/api/labs/${lab.id}/revisions/${revisionId}/duplicate`, {
          targetLabId: lab.id,
          name: 'No',
        })
      ).status,
    ).toBe(403)
  })

  it('refuses to change or delete a stored revision at the database level', async () => {
    const { revisionId } = await labWithDesign()
    const pg = await import('pg')
    const { inject } = await import('vitest')
    const client = new pg.default.Client({ connectionString: inject('databaseUrl') })
    await client.connect()
    await expect(
      client.query('update revisions set message = $1 where id = $2', ['rewritten', revisionId]),
    ).rejects.toThrow(/immutable/)
    await expect(client.query('delete from revisions where id = $1', [revisionId])).rejects.toThrow(/immutable/)
    await client.end()
  })
})
