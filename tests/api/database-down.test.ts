// PostgreSQL stops in the middle of a run (every connection dropped, new ones refused) and comes back: the API
// answers 503 with Retry-After meanwhile (never 500), /api/health says so, and the server recovers alone.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'
import { startServer, type ServerInstance } from '../support/instance'
import { startTcpProxy, type TcpProxy } from '../support/tcpProxy'

let proxy: TcpProxy
let server: ServerInstance
beforeAll(async () => {
  const url = new URL(inject('databaseUrl'))
  proxy = await startTcpProxy({ host: url.hostname, port: Number(url.port || 5432) })
  url.host = `127.0.0.1:${proxy.port}`
  server = await startServer({ databaseUrl: url.toString(), name: 'api-database-down' })
})
afterAll(async () => {
  await server?.stop()
  await proxy?.close()
})

const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))

describe('the database stops mid-run and comes back', () => {
  it('answers 503 with Retry-After while it is down, never 500, and recovers without a restart', async () => {
    const {
      lab,
      people: [designer],
    } = await makeLab(['designer'])
    const call = async (method: string, path: string, body?: unknown, cookie = '') => {
      const res = await fetch(server.baseURL + path, {
        method,
        headers: { 'content-type': 'application/json', cookie },
        body: body === undefined ? undefined : JSON.stringify(body),
        signal: AbortSignal.timeout(15_000),
      })
      const text = await res.text()
      return {
        status: res.status,
        retryAfter: res.headers.get('retry-after'),
        json: text ? JSON.parse(text) : null,
        cookies: res.headers.getSetCookie(),
      }
    }
    const login = await call('POST', '/api/auth/login', { email: designer!.email, password: TEST_PASSWORD })
    expect(login.status).toBe(200)
    const cookie = login.cookies.map(c => c.split(';')[0]).join('; ')
    const created = await call(
      'POST',
      `/api/labs/${lab.id}/designs`,
      { name: 'Fault chip', document: fixtureDocument() },
      cookie,
    )
    expect(created.status).toBe(201)

    // Readers and writers keep going through the outage.
    const statuses: number[] = []
    let running = true
    const load = Array.from({ length: 6 }, async (_, i) => {
      while (running) {
        const res = await (
          i % 3
            ? call('GET', `/api/labs/${lab.id}/designs`, undefined, cookie)
            : call(
                'POST',
                `/api/labs/${lab.id}/designs/${created.json.designId}/revisions`,
                { parentId: created.json.revisionId, message: `load ${i}`, document: fixtureDocument(), branch: true },
                cookie,
              )
        ).catch(() => ({ status: 0 })) // 0: no answer at all (the server went away)
        statuses.push(res.status)
        await sleep(20)
      }
    })
    await sleep(500)
    await proxy.cut()
    await sleep(1000)
    const health = await call('GET', '/api/health')
    expect(health.status).toBe(503)
    expect(health.json).toMatchObject({ ok: false, database: 'unreachable' })
    expect(health.retryAfter).toBe('5')
    const read = await call('GET', `/api/labs/${lab.id}/designs`, undefined, cookie)
    expect(read.status).toBe(503)
    expect(read.retryAfter).toBe('5')
    expect(read.json.message).toMatch(/database is not answering/)
    const signIn = await call('POST', '/api/auth/login', { email: designer!.email, password: TEST_PASSWORD })
    expect(signIn.status).toBe(503)
    await sleep(1000)

    await proxy.restore()
    const t0 = performance.now()
    let back = await call('GET', '/api/health')
    while (back.status !== 200 && performance.now() - t0 < 10_000) {
      await sleep(100)
      back = await call('GET', '/api/health')
    }
    expect(back.json).toMatchObject({ ok: true, database: 'ok' })
    await sleep(500)
    running = false
    await Promise.all(load)

    expect(server.child.exitCode).toBeNull()
    const seen = [...new Set(statuses)].sort()
    expect(
      seen.filter(s => s === 0 || (s >= 500 && s !== 503)),
      `answers seen: ${seen.join(', ')}`,
    ).toEqual([])
    expect(statuses).toContain(503)
    expect((await call('GET', `/api/labs/${lab.id}/designs`, undefined, cookie)).status).toBe(200)
    const saved = await call(
      'POST',
      `/api/labs/${lab.id}/designs/${created.json.designId}/revisions`,
      { parentId: created.json.revisionId, message: 'after', document: fixtureDocument(), branch: true },
      cookie,
    )
    expect(saved.status).toBe(201)
  }, 60_000)
})
