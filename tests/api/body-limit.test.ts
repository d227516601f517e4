// Request bodies are counted on the stream, whatever the transfer encoding: 8 MiB on the routes that carry chip
// documents, 64 KiB everywhere else (docs/api-limits.md). A body over its limit answers 413 as soon as the limit is
// passed — before a long upload ends — and the server never holds more than the limit in memory.
import { randomUUID } from 'node:crypto'
import { readdirSync, readFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { request as httpRequest } from 'node:http'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { startServer, type ServerInstance } from '../support/instance'
import example from '../fixtures/forecast/t-junction-request.json'

const MiB = 1024 * 1024
const DOCUMENT_LIMIT = 8 * MiB
const SMALL_LIMIT = 64 * 1024
const UPLOAD_LIMIT = 25 * MiB

interface Upload {
  status: number
  json: any
  sentAtAnswer: number
  uploadDone: boolean
  ms: number
}

/**
 * Sends `total` bytes (`head`, spaces, `tail`) to `path`, chunked or with a Content-Length, in 1 MiB writes that
 * wait for the socket; stops sending as soon as an answer arrives and reports how much had been sent by then.
 * `hold` sends `total` bytes and then waits for the answer without ending the body.
 */
function upload(
  base: string,
  path: string,
  opts: {
    cookie: string
    total: number
    head?: string
    tail?: string
    chunked: boolean
    declared?: number
    hold?: boolean
    contentType?: string
  },
): Promise<Upload> {
  const head = Buffer.from(opts.head ?? '')
  const tail = Buffer.from(opts.tail ?? '')
  const headers: Record<string, string> = {
    'content-type': opts.contentType ?? 'application/json',
    cookie: opts.cookie,
  }
  if (!opts.chunked) headers['content-length'] = String(opts.declared ?? opts.total)
  const started = Date.now()
  return new Promise((resolve, reject) => {
    let sent = 0
    let answered = false
    let uploadDone = false
    let wake = () => {}
    const req = httpRequest(new URL(path, base), { method: 'POST', headers }, res => {
      answered = true
      const sentAtAnswer = sent
      const doneAtAnswer = uploadDone
      wake()
      let text = ''
      res.setEncoding('utf8')
      res.on('data', d => {
        text += d
      })
      res.on('end', () => {
        let json: any = text
        try {
          json = JSON.parse(text)
        } catch {
          /* not JSON */
        }
        if (!uploadDone) req.destroy()
        resolve({ status: res.statusCode!, json, sentAtAnswer, uploadDone: doneAtAnswer, ms: Date.now() - started })
      })
    })
    req.on('error', error => {
      if (!answered) reject(error)
    })
    const spaces = Buffer.alloc(MiB, 0x20)
    void (async () => {
      const write = async (chunk: Buffer) => {
        sent += chunk.length
        if (!req.write(chunk))
          await new Promise<void>(r => {
            wake = r
            req.once('drain', r)
          })
      }
      await write(head)
      let left = opts.total - head.length - tail.length
      while (left > 0 && !answered) {
        const n = Math.min(left, MiB)
        await write(n === MiB ? spaces : spaces.subarray(0, n))
        left -= n
      }
      if (answered) return
      if (tail.length) await write(tail)
      if (answered || opts.hold) return
      uploadDone = true
      req.end()
    })().catch(reject)
  })
}

let cookie = ''
let labId = ''
beforeAll(async () => {
  const { lab, people } = await makeLab(['admin'])
  labId = lab.id
  const api = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
  cookie = [...api.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
})

describe('body limits counted on the stream', () => {
  const forecast = JSON.stringify(example)
  for (const chunked of [false, true]) {
    const how = chunked ? 'chunked' : 'with Content-Length'
    it(`a document route (forecast, 8 MiB) takes exactly 8 MiB and refuses one byte more, ${how}`, async () => {
      const base = inject('baseURL')
      const under = await upload(base, '/api/v1/forecast', {
        cookie,
        chunked,
        total: DOCUMENT_LIMIT,
        head: forecast.slice(0, -1),
        tail: '}',
      })
      expect(under.status, JSON.stringify(under.json).slice(0, 300)).toBe(200)
      expect(under.json.dropletDiameter).toBeDefined()
      const over = await upload(base, '/api/v1/forecast', {
        cookie,
        chunked,
        total: DOCUMENT_LIMIT + 1,
        head: forecast.slice(0, -1),
        tail: '}',
      })
      expect(over.status).toBe(413)
      expect(over.json.message).toMatch(/8 MiB/)
    })

    it(`a small route (invitations, 64 KiB) takes exactly 64 KiB and refuses one byte more, ${how}`, async () => {
      const base = inject('baseURL')
      const body = (email: string) => JSON.stringify({ email, role: 'reviewer' }).slice(0, -1)
      const under = await upload(base, `/api/labs/${labId}/invitations`, {
        cookie,
        chunked,
        total: SMALL_LIMIT,
        head: body(`lim-${randomUUID().slice(0, 8)}@invited.example`),
        tail: '}',
      })
      expect(under.status, JSON.stringify(under.json)).toBe(201)
      const over = await upload(base, `/api/labs/${labId}/invitations`, {
        cookie,
        chunked,
        total: SMALL_LIMIT + 1,
        head: body(`lim-${randomUUID().slice(0, 8)}@invited.example`),
        tail: '}',
      })
      expect(over.status).toBe(413)
      expect(over.json.message).toMatch(/64 KiB/)
    })
  }

  it('the micrograph route (25 MiB, streamed to a file) refuses one byte more either way, and keeps no file of it', async () => {
    const uploads = () => new Set(readdirSync(tmpdir()).filter(name => name.startsWith('dropwright-upload-')))
    const before = uploads()
    for (const chunked of [false, true]) {
      const over = await upload(inject('baseURL'), `/api/labs/${labId}/bench-runs/${randomUUID()}/micrographs`, {
        cookie,
        chunked,
        total: UPLOAD_LIMIT + 1,
        head: '--x\r\nContent-Disposition: form-data; name="image"; filename="big.png"\r\n\r\n',
        tail: '\r\n--x--\r\n',
        contentType: 'multipart/form-data; boundary=x',
      })
      expect(over.status, JSON.stringify(over.json)).toBe(413)
      expect(over.json.message).toMatch(/25 MiB/)
    }
    // The folder each upload streamed into is removed with it (other test files may be uploading meanwhile).
    await expect.poll(() => [...uploads()].filter(name => !before.has(name)), { timeout: 3000 }).toEqual([])
  })

  it('answers 413 at once to a declared Content-Length over the limit, without waiting for the body', async () => {
    // 400 MiB announced, 1 KiB sent, then the client waits: the answer comes anyway, in well under a second.
    const res = await upload(inject('baseURL'), `/api/labs/${labId}/invitations`, {
      cookie,
      chunked: false,
      total: 1024,
      declared: 400 * MiB,
      hold: true,
    })
    expect(res.status).toBe(413)
    expect(res.json.message).toMatch(/400 MiB.*64 KiB/)
    expect(res.ms).toBeLessThan(2000)
  })

  it('the next request on the server is answered normally after a refused upload', async () => {
    const res = await fetch(`${inject('baseURL')}/api/health`)
    expect(res.status).toBe(200)
  })
})

describe('memory stays bounded under huge uploads (own server instance)', () => {
  let server: ServerInstance
  let instanceCookie = ''
  beforeAll(async () => {
    server = await startServer({ databaseUrl: inject('databaseUrl'), name: 'body-limit' })
    const api = await new ApiClient(server.baseURL).signIn('designer@quillmere.example')
    instanceCookie = [...api.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
    // Warm the route up, so the baseline below includes its code.
    expect((await api.post('/api/v1/forecast', example)).status).toBe(200)
  })
  afterAll(async () => {
    await server?.stop()
  })

  const peakRss = () =>
    Number(/VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${server.child.pid}/status`, 'utf8'))![1]) * 1024

  it('four 200 MiB chunked uploads at once: each answered 413 long before it ends, peak memory grows < 64 MiB', async () => {
    const before = peakRss()
    const results = await Promise.all(
      [0, 1, 2, 3].map(() =>
        upload(server.baseURL, '/api/v1/forecast', { cookie: instanceCookie, chunked: true, total: 200 * MiB }),
      ),
    )
    for (const r of results) {
      expect(r.status).toBe(413)
      expect(r.uploadDone).toBe(false)
      expect(r.sentAtAnswer).toBeLessThan(100 * MiB)
    }
    const grew = peakRss() - before
    expect(grew, `peak RSS grew by ${(grew / MiB).toFixed(1)} MiB`).toBeLessThan(64 * MiB)
    // And the server still answers.
    expect((await fetch(`${server.baseURL}/api/health`)).status).toBe(200)
  })

  it('a 200 MiB chunked body on a small route (invitations) is refused the same way, at 64 KiB', async () => {
    const before = peakRss()
    // Sessions live in PostgreSQL: the lab admin's cookie from the main test server works on this instance too.
    const r = await upload(server.baseURL, `/api/labs/${labId}/invitations`, {
      cookie,
      chunked: true,
      total: 200 * MiB,
    })
    expect(r.status).toBe(413)
    expect(r.uploadDone).toBe(false)
    expect(r.sentAtAnswer).toBeLessThan(100 * MiB)
    expect(peakRss() - before).toBeLessThan(64 * MiB)
  })
})
