// The designs list one page at a time: offset + limit in the chosen order, the total in X-Total-Count, filters kept.
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'

describe('designs list paging (real server, real PostgreSQL)', () => {
  let api: ApiClient
  let labId: string
  const names = [
    'Paging chip 1',
    'Paging chip 2',
    'Paging chip 3',
    'Paging chip 4',
    'Paging chip 5',
    'Paging chip 6',
    'Other chip 7',
  ]

  beforeAll(async () => {
    const { lab, people } = await makeLab(['designer'])
    labId = lab.id
    api = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
    for (const name of names) expect((await api.post(`/api/labs/${labId}/designs`, { name })).status).toBe(201)
  })

  const page = (query: string) => api.get(`/api/labs/${labId}/designs?${query}`)
  const namesOf = (res: { json: { name: string }[] }) => res.json.map(d => d.name)

  it('pages through every design once, in order, with the total on every page', async () => {
    const sorted = [...names].sort((a, b) => a.localeCompare(b))
    for (const dir of ['asc', 'desc'] as const) {
      const seen: string[] = []
      for (const n of [1, 2, 3]) {
        const res = await page(`sort=name&dir=${dir}&pageSize=3&page=${n}`)
        expect(res.status).toBe(200)
        expect(res.headers.get('x-total-count')).toBe('7')
        expect(res.headers.get('x-page')).toBe(String(n))
        expect(res.headers.get('x-page-size')).toBe('3')
        expect(res.json).toHaveLength(n < 3 ? 3 : 1)
        seen.push(...namesOf(res))
      }
      expect(seen).toEqual(dir === 'asc' ? sorted : [...sorted].reverse())
    }
    const past = await page('sort=name&pageSize=3&page=4')
    expect(past.json).toEqual([])
    expect(past.headers.get('x-total-count')).toBe('7')
  })

  it('keeps search and status filters in the page and in the total', async () => {
    const search = await page('q=paging&sort=name&dir=asc&pageSize=4&page=2')
    expect(search.headers.get('x-total-count')).toBe('6')
    expect(namesOf(search)).toEqual(['Paging chip 5', 'Paging chip 6'])
    // A search counts its matches with its page; past the last page (no rows to carry it) the total still comes.
    const pastSearch = await page('q=paging&pageSize=4&page=3')
    expect(pastSearch.json).toEqual([])
    expect(pastSearch.headers.get('x-total-count')).toBe('6')
    const searchDrafts = await page('q=chip%206&status=draft')
    expect(namesOf(searchDrafts)).toEqual(['Paging chip 6'])
    expect(searchDrafts.headers.get('x-total-count')).toBe('1')
    const drafts = await page('status=draft&pageSize=5')
    expect(drafts.headers.get('x-total-count')).toBe('7')
    expect(drafts.json).toHaveLength(5)
    const released = await page('status=released')
    expect(released.headers.get('x-total-count')).toBe('0')
    expect(released.json).toEqual([])
  })

  it('answers 50 designs by default and refuses a page size over 200 or a page below 1, naming the field', async () => {
    const all = await page('')
    expect(all.headers.get('x-page-size')).toBe('50')
    expect(all.json).toHaveLength(7)
    const big = await page('pageSize=201')
    expect(big.status).toBe(400)
    expect(big.json.data.issues[0].path).toBe('pageSize')
    expect(big.json.data.issues[0].message).toMatch(/at most 200/)
    const zero = await page('page=0')
    expect(zero.status).toBe(400)
    expect(zero.json.data.issues[0].path).toBe('page')
    expect((await page('page=two')).status).toBe(400)
  })

  it("counts only the caller's lab", async () => {
    const other = await makeLab(['designer'])
    const them = await new ApiClient().signIn(other.people[0]!.email, TEST_PASSWORD)
    const res = await them.get(`/api/labs/${other.lab.id}/designs`)
    expect(res.headers.get('x-total-count')).toBe('0')
    expect((await them.get(`/api/labs/${labId}/designs`)).status).toBe(404)
  })
})
