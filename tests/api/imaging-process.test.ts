// Micrographs are parsed, stored and measured in a child process of the server whose every thread runs below the
// request thread (server/workers/imaging.ts), so a 20 MB upload does not slow the pages others are loading. Checked
// on an instance of its own, through /proc: the server's children, their threads and each thread's nice value.
import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { designerWithDesign } from '../support/designs'
import { TEST_PASSWORD } from '../support/factory'
import { startServer, type ServerInstance } from '../support/instance'
import { dropsPng } from '../support/micrograph'

let server: ServerInstance
let api: ApiClient
let setup: Awaited<ReturnType<typeof designerWithDesign>>

/** Field 19 of /proc/<pid>/task/<tid>/stat (after the command in parentheses) is the thread's nice value. */
const niceOf = (pid: number, tid: string) => {
  const stat = readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8')
  return Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[16])
}
const threadNices = (pid: number) => readdirSync(`/proc/${pid}/task`).map(tid => niceOf(pid, tid))
const childrenOf = (pid: number) =>
  readdirSync('/proc')
    .filter(name => /^\d+$/.test(name))
    .filter(name => {
      try {
        return new RegExp(`^PPid:\\s+${pid}$`, 'm').test(readFileSync(`/proc/${name}/status`, 'utf8'))
      } catch {
        return false // ended meanwhile
      }
    })
    .map(Number)

beforeAll(async () => {
  setup = await designerWithDesign('Imaging process check')
  server = await startServer({ databaseUrl: inject('databaseUrl'), name: 'imaging-process' })
  api = await new ApiClient(server.baseURL).signIn(setup.email, TEST_PASSWORD)
})
afterAll(async () => {
  await server?.stop()
})

describe('the imaging process', () => {
  it('measures an upload in a child process whose threads all run at nice 10, while the server stays at 0', async () => {
    const pid = server.child.pid!
    expect(childrenOf(pid)).toEqual([])
    const run = await api.post(`/api/labs/${setup.labId}/revisions/${setup.revisionId}/bench-runs`, {
      source: 'micrograph',
    })
    expect(run.status).toBe(201)
    const { png, drops } = await dropsPng(9, 40)
    const form = new FormData()
    form.set('image', new Blob([png as Uint8Array<ArrayBuffer>]), 'drops.png')
    form.set('umPerPx', '0.5')
    const res = await fetch(`${server.baseURL}/api/labs/${setup.labId}/bench-runs/${run.json.id}/micrographs`, {
      method: 'POST',
      body: form,
      headers: { cookie: [...api.cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
    })
    const json = await res.json()
    expect(res.status, JSON.stringify(json)).toBe(201)
    expect(json.summary.count).toBe(drops.length)

    const children = childrenOf(pid)
    expect(children).toHaveLength(1)
    const child = children[0]!
    expect(readFileSync(`/proc/${child}/cmdline`, 'utf8')).toContain('tinypool')
    const nices = threadNices(child)
    // libvips' threads, the thread pool and the collector's helpers all started by then, every one below the server.
    expect(nices.length).toBeGreaterThan(4)
    expect(new Set(nices)).toEqual(new Set([10]))
    expect(niceOf(pid, String(pid))).toBe(0)
  })

  it('brings an error raised there back with its status and message', async () => {
    const run = await api.post(`/api/labs/${setup.labId}/revisions/${setup.revisionId}/bench-runs`, {
      source: 'micrograph',
    })
    const form = new FormData()
    form.set('image', new Blob([new Uint8Array([0x4d, 0x5a, 0x90, 0, 3, 0, 0, 0, 4, 0, 0, 0, 0xff, 0xff])]), 'a.png')
    form.set('umPerPx', '0.5')
    const cookie = [...api.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
    const url = `${server.baseURL}/api/labs/${setup.labId}/bench-runs/${run.json.id}/micrographs`
    const notImage = await fetch(url, { method: 'POST', body: form, headers: { cookie } })
    expect(notImage.status).toBe(415)
    expect((await notImage.json()).message).toMatch(/"a\.png" is .*whatever its name says/)

    form.set('umPerPx', '-2')
    const badScale = await fetch(url, { method: 'POST', body: form, headers: { cookie } })
    expect(badScale.status).toBe(400)
    expect((await badScale.json()).message).toMatch(/Scale is invalid.*> 0 µm per pixel/)
  })

  it('does not outlive the server: stopped with it', async () => {
    const pid = server.child.pid!
    const children = childrenOf(pid)
    expect(children).toHaveLength(1)
    await server.stop()
    await expect.poll(() => existsSync(`/proc/${children[0]}`), { timeout: 10_000 }).toBe(false)
  })
})
