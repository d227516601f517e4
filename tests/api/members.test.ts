import { describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'

const as = (email: string) => new ApiClient().signIn(email, TEST_PASSWORD)

describe('lab members (real server, real PostgreSQL)', () => {
  it("lists members and roles of the caller's lab", async () => {
    const api = await signedIn('reviewer@quillmere.example')
    const labId = await api.labId('quillmere')
    const res = await api.get(`/api/labs/${labId}/members`)
    expect(res.status).toBe(200)
    expect(res.json.map((m: { email: string; role: string }) => `${m.email}:${m.role}`)).toContain(
      'designer@quillmere.example:designer',
    )
  })

  it("hides another lab's members behind 404, and an unknown lab too", async () => {
    const api = await signedIn('designer@quillmere.example')
    const other = await (await signedIn('fabricator@brackenfold.example')).labId('brackenfold')
    expect((await api.get(`/api/labs/${other}/members`)).status).toBe(404)
    expect((await api.get('/api/labs/00000000-0000-4000-8000-000000000000/members')).status).toBe(404)
    const bad = await api.get('/api/labs/not-a-uuid/members')
    expect(bad.status).toBe(400)
    expect(bad.json.data.issues[0].path).toBe('labId')
  })

  it('forbids a role that may not (403), for reading and for managing', async () => {
    const fab = await signedIn('fabricator@brackenfold.example')
    const quillmere = await fab.labId('quillmere')
    expect((await fab.get(`/api/labs/${quillmere}/members`)).status).toBe(403)
    const {
      lab,
      people: [admin, designer],
    } = await makeLab(['admin', 'designer'])
    const d = await as(designer!.email)
    expect((await d.patch(`/api/labs/${lab.id}/members/${admin!.id}`, { role: 'designer' })).status).toBe(403)
    expect((await d.delete(`/api/labs/${lab.id}/members/${admin!.id}`)).status).toBe(403)
  })

  it('lets an admin change a role and remove a member', async () => {
    const {
      lab,
      people: [admin, designer, reviewer],
    } = await makeLab(['admin', 'designer', 'reviewer'])
    const a = await as(admin!.email)
    const changed = await a.patch(`/api/labs/${lab.id}/members/${designer!.id}`, { role: 'reviewer' })
    expect(changed.status).toBe(200)
    expect(changed.json.role).toBe('reviewer')
    expect((await a.delete(`/api/labs/${lab.id}/members/${reviewer!.id}`)).status).toBe(204)
    const list = await a.get(`/api/labs/${lab.id}/members`)
    expect(list.json.map((m: { userId: string }) => m.userId).sort()).toEqual([admin!.id, designer!.id].sort())
    // the removed member loses access at once
    const gone = await as(reviewer!.email)
    expect((await gone.get(`/api/labs/${lab.id}/members`)).status).toBe(404)
  })

  it('keeps the last admin: no self-removal, no self-demotion', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin', 'designer'])
    const a = await as(admin!.email)
    const removal = await a.delete(`/api/labs/${lab.id}/members/${admin!.id}`)
    expect(removal.status).toBe(409)
    expect(removal.json.message).toMatch(/at least one admin/)
    expect((await a.patch(`/api/labs/${lab.id}/members/${admin!.id}`, { role: 'designer' })).status).toBe(409)
  })

  it('rejects an unknown role with 400 naming the field', async () => {
    const {
      lab,
      people: [admin, designer],
    } = await makeLab(['admin', 'designer'])
    const a = await as(admin!.email)
    const res = await a.patch(`/api/labs/${lab.id}/members/${designer!.id}`, { role: 'owner' })
    expect(res.status).toBe(400)
    expect(res.json.data.issues[0].path).toBe('role')
  })
})
