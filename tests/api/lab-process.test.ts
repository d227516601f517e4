// A design on the lab's own fabrication process, over real HTTP and PostgreSQL: both fab sheets (the PDF, read back
// with Debian's pdftotext, and the printable page as the server renders it) carry that process's name and values;
// a library edit after the release leaves them as released; the as-built is checked with the same values; the
// planner API plans on the lab's process and refuses another lab's without saying anything about it.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { beforeAll, describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { labWithDesign } from '../support/designs'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'

type Setup = Awaited<ReturnType<typeof labWithDesign>>

// Invented values, unlike either built-in process (film mask: 20 µm features, 2000 mbar bond).
const PROCESS = {
  kind: 'process',
  key: 'coarse-mould',
  name: 'Our coarse moulding process',
  source: 'measured in our lab',
  material: 'PDMS',
  minFeature: 35,
  minGap: 45,
  minDepth: 15,
  maxDepth: 180,
  maxWidthToDepth: 12,
  maxWallDepthToWidth: 3,
  portEdgeDistance: 900,
  portSpacing: 900,
  bondPressureLimitMbar: 1234,
}
const LINE =
  'Our coarse moulding process: minimum feature 35 µm, minimum gap 45 µm, depths 15 µm to 180 µm, bond limit 1234 mbar'

const cookieOf = (client: ApiClient) => [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ')

/** The fab sheet PDF as text (pdftotext -layout, whitespace folded). */
async function pdfText(client: ApiClient, labId: string, revisionId: string): Promise<string> {
  const res = await fetch(`${inject('baseURL')}/api/labs/${labId}/revisions/${revisionId}/fab-sheet.pdf`, {
    headers: { cookie: cookieOf(client) },
  })
  expect(res.status).toBe(200)
  const file = join(mkdtempSync(join(tmpdir(), 'dw-pdf-')), 'sheet.pdf')
  writeFileSync(file, new Uint8Array(await res.arrayBuffer()))
  return execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')
}

/** The printable fab sheet's text as the server renders the page (tags dropped, entities and whitespace folded). */
async function printableText(client: ApiClient, labId: string, revisionId: string): Promise<string> {
  const res = await fetch(`${inject('baseURL')}/labs/${labId}/revisions/${revisionId}/fab-sheet`, {
    headers: { cookie: cookieOf(client), accept: 'text/html' },
  })
  expect(res.status).toBe(200)
  const html = await res.text()
  const article = /<article[^>]*data-test="fab-sheet"[^>]*>([\s\S]*?)<\/article>/.exec(html)
  expect(article, 'the server renders the fab sheet').not.toBeNull()
  return article![1]!
    .replace(/<!--[\s\S]*?-->/g, '')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ')
}

let s: Setup
let entryId: string
let designId: string
let revisionId: string

beforeAll(async () => {
  s = await labWithDesign()
  const added = await s.as.admin.post(`/api/labs/${s.lab.id}/libraries`, PROCESS)
  expect(added.status, JSON.stringify(added.json)).toBe(201)
  expect(added.json.key).toBe('lab-coarse-mould')
  entryId = added.json.id
  // A design on the lab's process, reviewed, approved and released.
  const created = await s.as.designer.post(`/api/labs/${s.lab.id}/designs`, {
    name: 'Coarse chip',
    processId: 'lab-coarse-mould',
    document: fixtureDocument(),
  })
  expect(created.status, JSON.stringify(created.json)).toBe(201)
  designId = created.json.designId
  revisionId = created.json.revisionId
  const base = `/api/labs/${s.lab.id}/revisions/${revisionId}`
  expect((await s.as.designer.post(`${base}/review-requests`, { reviewerIds: [s.ids.reviewer] })).status).toBeLessThan(
    300,
  )
  expect((await s.as.reviewer.post(`${base}/verdicts`, { verdict: 'approve' })).status).toBeLessThan(300)
  const released = await s.as.admin.post(`${base}/release`, { note: 'go', order: {} })
  expect(released.status, JSON.stringify(released.json)).toBe(200)
}, 120_000)

describe("a design on the lab's own process", () => {
  it("the PDF and the printable fab sheet carry that process's name, values and source, not a built-in one's", async () => {
    const pdf = await pdfText(s.as.fabricator, s.lab.id, revisionId)
    const page = await printableText(s.as.fabricator, s.lab.id, revisionId)
    // Both sheets: the lab's process and its source, never a built-in one, and the inlets through shared/format
    // ("oil-in: flow rate 10 µL/min", the fixture's operating point).
    for (const sheet of [pdf, page]) {
      expect(sheet).toContain(LINE)
      expect(sheet).toContain("values: measured in our lab; the lab's library, as stored with the revision")
      expect(sheet).not.toMatch(/Film-mask soft lithography|Chrome-mask soft lithography/)
      expect(sheet).toContain('oil-in: flow rate 10 µL/min')
      expect(sheet).toContain('22 °C')
    }
    expect(pdf).toContain('water-in: flow rate 5 µL/min')
    expect(pdf).toContain(
      'Continuous phase n-hexadecane, dispersed phase water, surfactant sorbitan-monooleate, 22 °C.',
    )
  }, 60_000)

  it("a library edit after the release leaves the released sheets' process values unchanged; new designs get the new ones", async () => {
    const edit = await s.as.admin.patch(`/api/labs/${s.lab.id}/libraries/${entryId}`, {
      ...PROCESS,
      key: undefined,
      name: 'Our coarse moulding process, v2',
      minFeature: 60,
      bondPressureLimitMbar: 800,
    })
    expect(edit.status, JSON.stringify(edit.json)).toBe(200)
    const pdf = await pdfText(s.as.fabricator, s.lab.id, revisionId)
    expect(pdf).toContain(LINE)
    expect(pdf).not.toContain('v2')
    expect(pdf).not.toContain('800 mbar')
    const page = await printableText(s.as.designer, s.lab.id, revisionId)
    expect(page).toContain(LINE)
    expect(page).not.toContain('v2')
    // The edit did take: a new revision of the design is checked with the new values.
    const head = (await s.as.designer.get(`/api/labs/${s.lab.id}/revisions/${revisionId}`)).json
    const saved = await s.as.designer.post(`/api/labs/${s.lab.id}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: 'after the edit',
      document: head.document,
    })
    expect(saved.status, JSON.stringify(saved.json)).toBe(201)
    const next = (await s.as.designer.get(`/api/labs/${s.lab.id}/revisions/${saved.json.revisionId}`)).json
    expect(next.summary.library.process).toMatchObject({
      id: 'lab-coarse-mould',
      name: 'Our coarse moulding process, v2',
      origin: 'lab',
      values: { minFeature: 60, bondPressureLimitMbar: 800 },
    })
    await s.as.admin.patch(`/api/labs/${s.lab.id}/libraries/${entryId}`, { ...PROCESS, key: undefined })
  }, 90_000)

  it("the as-built chip is checked with the lab process's values: 190 µm deep breaks its 180 µm limit (the film mask allows 250 µm)", async () => {
    const recorded = await s.as.fabricator.post(`/api/labs/${s.lab.id}/revisions/${revisionId}/as-built`, {
      depths: [{ layerId: 'ch50', depthUm: 190 }],
    })
    expect(recorded.status, JSON.stringify(recorded.json)).toBe(201)
    const errors = recorded.json.changes.find(
      (c: { what: string; id: string }) => c.what === 'findings' && c.id === 'errors',
    )
    expect(errors.designed).toBe(0)
    expect(errors.asBuilt).toBeGreaterThan(0)
    expect(errors.exceeds).toBe(true)
  }, 60_000)
})

describe("POST /api/v1/plan?lab= on the lab's own process", () => {
  const request = (process: string) => ({
    junction: { kind: 't-junction', mainWidth: '100 um', inletWidth: '50 um', depth: '50 um' },
    continuous: { liquid: 'hydrofluoroether' },
    dispersed: { liquid: 'water' },
    interfacialTension: '3 mN/m',
    target: { dropletDiameter: '40 um' },
    search: { points: 4 },
    process,
  })
  let stranger: ApiClient
  let strangerLab: string

  beforeAll(async () => {
    const other = await makeLab(['admin'])
    strangerLab = other.lab.id
    stranger = await new ApiClient().signIn(other.people[0]!.email, TEST_PASSWORD)
    const theirs = await stranger.post(`/api/labs/${strangerLab}/libraries`, {
      ...PROCESS,
      key: 'secret-etch',
      name: 'Their secret etch',
      minFeature: 7,
    })
    expect(theirs.status, JSON.stringify(theirs.json)).toBe(201)
  })

  it("plans on the caller's lab process, checked against its values", async () => {
    const res = await s.as.designer.post(`/api/v1/plan?lab=${s.lab.id}`, request('lab-coarse-mould'))
    expect(res.status, JSON.stringify(res.json)).toBe(200)
    expect(res.json.geometry.length).toBeGreaterThan(0)
    for (const g of res.json.geometry)
      expect(g.process).toMatchObject({ id: 'lab-coarse-mould', name: 'Our coarse moulding process' })
    expect(
      JSON.stringify(res.json.geometry.map((g: { process: { problems: string[] } }) => g.process.problems)),
    ).toMatch(/35 µm|45 µm|15 µm|180 µm/)
  }, 60_000)

  it('refuses another lab\'s process id (400 on "process", naming only what the caller may use) and another lab (404)', async () => {
    const theirs = await s.as.designer.post(`/api/v1/plan?lab=${s.lab.id}`, request('lab-secret-etch'))
    expect(theirs.status).toBe(400)
    expect(theirs.json.data.issues.map((i: { path: string }) => i.path)).toEqual(['process'])
    expect(theirs.json.message).toContain('"lab-coarse-mould"')
    expect(JSON.stringify(theirs.json)).not.toMatch(/Their secret etch|7 µm/)
    const noLab = await s.as.designer.post('/api/v1/plan', request('lab-coarse-mould'))
    expect(noLab.status).toBe(400)
    expect(noLab.json.data.issues[0].path).toBe('process')
    expect(noLab.json.message).toContain('?lab=')
    // Naming the other lab itself: not a member, so 404 — its processes are never looked up.
    const otherLab = await s.as.designer.post(`/api/v1/plan?lab=${strangerLab}`, request('lab-secret-etch'))
    expect(otherLab.status).toBe(404)
    expect(JSON.stringify(otherLab.json)).not.toMatch(/Their secret etch/)
    // The stranger plans on its own process.
    expect((await stranger.post(`/api/v1/plan?lab=${strangerLab}`, request('lab-secret-etch'))).status).toBe(200)
  }, 60_000)
})
