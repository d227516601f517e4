// Concurrent saves on one design over real HTTP, at a concurrency that exhausts both instances' connection pools,
// with readers running: the database work must never wedge (one pool checkout per request path, lock time-outs),
// and every race must end with exactly one winner and 409 for the rest.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { ApiClient } from '../support/api'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'
import { startServer, type ServerInstance } from '../support/instance'

const ROUNDS = 6
const SAVES_PER_ROUND = 120 // 60 per instance, six times the pool of 10 each
const READERS = 16
const TIMEOUT_MS = 20_000

let second: ServerInstance
beforeAll(async () => {
  second = await startServer({ databaseUrl: inject('databaseUrl'), name: 'api-second', env: { DW_MAIL_WORKER: '0' } })
})
afterAll(async () => {
  await second?.stop()
})

type Outcome = number | 'timeout' | 'network'
async function send(client: ApiClient, base: string, method: string, path: string, body?: unknown): Promise<Outcome> {
  try {
    const res = await fetch(base + path, {
      method,
      signal: AbortSignal.timeout(TIMEOUT_MS),
      headers: {
        'content-type': 'application/json',
        cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; '),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
    })
    await res.arrayBuffer()
    return res.status
  } catch (error) {
    return (error as Error).name === 'TimeoutError' ? 'timeout' : 'network'
  }
}

describe('saves racing on one design across two server instances', () => {
  it(`${ROUNDS} rounds × ${SAVES_PER_ROUND} concurrent saves with ${READERS} readers: one 201 per round, the rest 409, no wedge`, async () => {
    const { lab, people } = await makeLab(['designer'])
    const api = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
    const bases = [api.baseURL, second.baseURL]
    const created = await api.post(`/api/labs/${lab.id}/designs`, { name: 'Race chip', document: fixtureDocument() })
    expect(created.status).toBe(201)
    const { designId } = created.json as { designId: string }
    let parent = created.json.revisionId as string
    const doc = fixtureDocument()
    for (let round = 0; round < ROUNDS; round++) {
      let reading = true
      const readerOutcomes: Outcome[] = []
      const readers = Array.from({ length: READERS }, async (_, i) => {
        while (reading) {
          const path = i % 2 ? `/api/labs/${lab.id}/designs` : `/api/labs/${lab.id}/designs/${designId}/revisions`
          readerOutcomes.push(await send(api, bases[i % 2]!, 'GET', path))
        }
      })
      const outcomes = await Promise.all(
        Array.from({ length: SAVES_PER_ROUND }, (_, i) =>
          send(api, bases[i % 2]!, 'POST', `/api/labs/${lab.id}/designs/${designId}/revisions`, {
            parentId: parent,
            message: `round ${round}, save ${i}`,
            document: doc,
          }),
        ),
      )
      reading = false
      await Promise.all(readers)
      const tally = (xs: Outcome[]) => xs.reduce<Record<string, number>>((t, o) => ({ ...t, [o]: (t[o] ?? 0) + 1 }), {})
      expect(tally(outcomes), `round ${round}`).toEqual({ 201: 1, 409: SAVES_PER_ROUND - 1 })
      expect(
        readerOutcomes.every(o => o === 200),
        `readers in round ${round}: ${JSON.stringify(tally(readerOutcomes))}`,
      ).toBe(true)
      const list = await api.get(`/api/labs/${lab.id}/designs/${designId}/revisions`)
      expect(list.json.length).toBe(round + 2)
      parent = list.json.at(-1).id
    }
    // Nothing is left holding a lock or a connection: a sign-in on each instance answers within a second.
    for (const base of bases) {
      const t0 = performance.now()
      const res = await fetch(`${base}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: people[0]!.email, password: TEST_PASSWORD }),
        signal: AbortSignal.timeout(5000),
      })
      expect(res.status).toBe(200)
      expect(performance.now() - t0).toBeLessThan(1000)
    }
  }, 240_000)
})
