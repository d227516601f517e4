// The lab's own library against the built server and PostgreSQL: who may read and write (admin writes, members who
// open designs read, fabricators 403, another lab 404), the forecast API with ?lab= (session and token), the
// lab's surfactant pair reaching the forecast (Ca ∝ 1/γ), the snapshot kept with a revision, the re-forecast with
// its differences, and the starter chips.
import { beforeAll, describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { labWithDesign } from '../support/designs'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'

type Setup = Awaited<ReturnType<typeof labWithDesign>>
let s: Setup
let base: string
let stranger: ApiClient
let strangerLab: string

// Invented values: a hydrocarbon oil measured at two temperatures.
const OIL = {
  kind: 'liquid',
  key: 'test-oil',
  name: 'Test oil, lot 1',
  source: 'measured in our lab',
  table: [
    { temperatureC: 20, viscosityMPaS: 6, densityKgPerM3: 830, surfaceTensionMNPerM: 28 },
    { temperatureC: 30, viscosityMPaS: 4.5, densityKgPerM3: 823, surfaceTensionMNPerM: 27 },
  ],
}
const PAIR = {
  kind: 'pair',
  liquids: ['water', 'lab-test-oil'],
  surfactant: 'our-surfactant',
  interfacialTensionMNPerM: 5,
  source: 'measured in our lab',
}

/** The fixture chip run on the lab's oil with the lab's surfactant. */
function labDocument() {
  const doc = fixtureDocument()
  doc.operatingPoints[0].continuousLiquid = { liquid: 'lab-test-oil' }
  doc.operatingPoints[0].surfactant = 'our-surfactant'
  return doc
}

beforeAll(async () => {
  s = await labWithDesign()
  base = `/api/labs/${s.lab.id}/libraries`
  const other = await makeLab(['admin'])
  strangerLab = other.lab.id
  stranger = await new ApiClient().signIn(other.people[0]!.email, TEST_PASSWORD)
})

describe('lab libraries', () => {
  let oilId: string
  let pairId: string

  it('admins add entries; designers read them; fabricators are refused; another lab gets 404', async () => {
    const oil = await s.as.admin.post(base, OIL)
    expect(oil.status, JSON.stringify(oil.json)).toBe(201)
    expect(oil.json).toMatchObject({
      kind: 'liquid',
      key: 'lab-test-oil',
      source: 'measured in our lab',
      archived: false,
    })
    oilId = oil.json.id
    const pair = await s.as.admin.post(base, PAIR)
    expect(pair.status, JSON.stringify(pair.json)).toBe(201)
    pairId = pair.json.id

    expect((await s.as.designer.post(base, { ...OIL, key: 'designer-oil' })).status).toBe(403)
    expect((await s.as.designer.patch(`${base}/${oilId}`, { ...OIL, key: undefined })).status).toBe(403)
    expect((await s.as.designer.post(`${base}/${oilId}/archive`, { archived: true })).status).toBe(403)
    const read = await s.as.designer.get(base)
    expect(read.status).toBe(200)
    expect(read.json.entries.map((e: { key: string }) => e.key).sort()).toEqual([
      'lab-test-oil',
      'lab-test-oil/water/our-surfactant',
    ])
    expect((await s.as.fabricator.get(base)).status).toBe(403)
    expect((await s.as.fabricator.post(base, { ...OIL, key: 'fab-oil' })).status).toBe(403)
    expect((await stranger.get(base)).status).toBe(404)
    expect((await stranger.post(base, { ...OIL, key: 'x' })).status).toBe(404)
    expect(
      (await stranger.patch(`${base}/${oilId}`, { kind: 'liquid', name: 'x', source: 'y', table: OIL.table })).status,
    ).toBe(404)
    // The stranger's own lab cannot reach this lab's entry through its own address either.
    expect(
      (await stranger.post(`/api/labs/${strangerLab}/libraries/${oilId}/archive`, { archived: true })).status,
    ).toBe(404)
  })

  it('refuses bad values with the field, the fix and the limit', async () => {
    const res = await s.as.admin.post(base, {
      ...OIL,
      key: 'bad-oil',
      table: [{ temperatureC: 20, viscosityMPaS: -1, densityKgPerM3: 830 }],
    })
    expect(res.status).toBe(400)
    expect(JSON.stringify(res.json)).toContain('Viscosity must be above 0 mPa·s')
    const dup = await s.as.admin.post(base, OIL)
    expect(dup.status).toBe(409)
    const unknown = await s.as.admin.post(base, { ...PAIR, liquids: ['water', 'lab-nothing'] })
    expect(unknown.status).toBe(400)
    expect(unknown.json.message).toContain('"lab-nothing" is neither a built-in liquid nor one of the lab\'s')
  })

  it("GET /api/v1/liquids?lab= lists the lab's entries beside the built-in ones (session and token), 404 for another lab", async () => {
    const plain = await s.as.designer.get('/api/v1/liquids')
    expect(plain.json.liquids.some((l: { id: string }) => l.id === 'lab-test-oil')).toBe(false)
    const withLab = await s.as.designer.get(`/api/v1/liquids?lab=${s.lab.id}`)
    expect(withLab.status).toBe(200)
    const oil = withLab.json.liquids.find((l: { id: string }) => l.id === 'lab-test-oil')
    expect(oil).toMatchObject({ origin: 'lab', name: 'Test oil, lot 1' })
    expect(oil.at20C.viscosity).toBeCloseTo(6e-3, 12) // the table's 20 °C row
    expect(withLab.json.liquids.find((l: { id: string }) => l.id === 'water').origin).toBe('built-in')
    expect(withLab.json.pairs[0]).toMatchObject({
      origin: 'lab',
      surfactant: 'our-surfactant',
      interfacialTension: { value: 5e-3 },
    })
    expect(withLab.json.surfactants).toContain('our-surfactant')
    expect((await stranger.get(`/api/v1/liquids?lab=${s.lab.id}`)).status).toBe(404)

    const made = await s.as.designer.post('/api/account/tokens', {
      name: 'library script',
      labId: s.lab.id,
      role: 'designer',
    })
    expect(made.status).toBe(201)
    const res = await fetch(`${inject('baseURL')}/api/v1/liquids?lab=${s.lab.id}`, {
      headers: { authorization: `Bearer ${made.json.token}` },
    })
    expect(res.status).toBe(200)
    expect(((await res.json()) as { liquids: Array<{ id: string }> }).liquids.some(l => l.id === 'lab-test-oil')).toBe(
      true,
    )
    const otherLab = await fetch(`${inject('baseURL')}/api/v1/liquids?lab=${strangerLab}`, {
      headers: { authorization: `Bearer ${made.json.token}` },
    })
    expect(otherLab.status).toBe(404)
  })

  it("the lab's surfactant pair reaches POST /api/v1/forecast?lab=: Ca scales as 1/γ when the admin edits γ", async () => {
    const without = await s.as.designer.post('/api/v1/forecast', { document: labDocument() })
    expect(without.status).toBe(400) // the built-in library has no "lab-test-oil"
    const first = await s.as.designer.post(`/api/v1/forecast?lab=${s.lab.id}`, { document: labDocument() })
    expect(first.status, JSON.stringify(first.json)).toBe(200)
    const f1 = first.json.junctions[0].forecast
    expect(f1.inputs.interfacialTension.value).toBeCloseTo(5e-3, 12)
    expect(f1.inputs.continuous.viscosity.value).toBeCloseTo(5.45e-3, 3) // between the 20 and 30 °C rows at 22 °C
    const edit = await s.as.admin.patch(`${base}/${pairId}`, { ...PAIR, kind: 'pair', interfacialTensionMNPerM: 2.5 })
    expect(edit.status, JSON.stringify(edit.json)).toBe(200)
    const second = await s.as.designer.post(`/api/v1/forecast?lab=${s.lab.id}`, { document: labDocument() })
    const f2 = second.json.junctions[0].forecast
    expect(f2.inputs.interfacialTension.value).toBeCloseTo(2.5e-3, 12)
    // Ca = μc·U/γ (Garstecki, Fuerstman, Stone & Whitesides 2006, Lab Chip 6, 437): same flows and μ, half γ → twice Ca.
    expect(f2.capillaryNumber.value / f1.capillaryNumber.value).toBeCloseTo(2, 9)
    await s.as.admin.patch(`${base}/${pairId}`, PAIR)
  })

  it("a single-junction request names the lab's surfactant too (it was refused as not a built-in one)", async () => {
    const junction = {
      junction: { kind: 't-junction', mainWidth: '100 um', inletWidth: '50 um', depth: '50 um' },
      continuous: { liquid: 'lab-test-oil' },
      dispersed: { liquid: 'water' },
      surfactant: 'our-surfactant',
      flow: { continuous: '10 uL/min', dispersed: '2 uL/min' },
    }
    const answer = await s.as.designer.post(`/api/v1/forecast?lab=${s.lab.id}`, junction)
    expect(answer.status, JSON.stringify(answer.json)).toBe(200)
    expect(answer.json.inputs.interfacialTension.value).toBeCloseTo(5e-3, 12)
    // Without the lab, the pair is unknown: a 400 that names it and the pairs there are.
    const unknown = await s.as.designer.post('/api/v1/forecast', {
      ...junction,
      continuous: { liquid: 'n-hexadecane' },
    })
    expect(unknown.status).toBe(400)
    expect(unknown.json.message).toContain('with surfactant "our-surfactant" is not in the library')
    const badId = await s.as.designer.post('/api/v1/forecast', { ...junction, surfactant: 'Our Surfactant 2 %' })
    expect(badId.status).toBe(400)
    expect(badId.json.message).toContain('Surfactant: lower-case letters, digits or hyphens')
  })

  it('a revision keeps the values it was forecast with; the re-forecast shows what a library edit changes', async () => {
    const created = await s.as.designer.post(`/api/labs/${s.lab.id}/designs`, {
      name: 'Lab oil chip',
      document: labDocument(),
    })
    expect(created.status, JSON.stringify(created.json)).toBe(201)
    const revisionPath = `/api/labs/${s.lab.id}/revisions/${created.json.revisionId}`
    const before = (await s.as.designer.get(revisionPath)).json.summary
    expect(before.forecastError).toBeNull()
    expect(before.library.interfacialTension).toMatchObject({ mNPerM: 5, origin: 'lab' })
    expect(before.library.continuous).toMatchObject({ id: 'lab-test-oil', origin: 'lab' })

    expect((await s.as.admin.patch(`${base}/${pairId}`, { ...PAIR, interfacialTensionMNPerM: 10 })).status).toBe(200)
    const after = (await s.as.designer.get(revisionPath)).json.summary
    expect(after).toEqual(before)

    const re = await s.as.designer.get(`${revisionPath}/reforecast`)
    expect(re.status, JSON.stringify(re.json)).toBe(200)
    expect(re.json.stored).toEqual(before)
    expect(re.json.current.library.interfacialTension.mNPerM).toBe(10)
    const tension = re.json.differences.find((d: { what: string }) => d.what === 'Interfacial tension')
    expect(tension).toEqual({ what: 'Interfacial tension', stored: 5, current: 10, unit: 'mN/m' })
    const diameter = re.json.differences.find(
      (d: { what: string }) => d.what === 'Droplet diameter at T-junction “tj-1”',
    )
    expect(diameter.unit).toBe('µm')
    expect(diameter.current).not.toBe(diameter.stored)
    expect((await s.as.fabricator.get(`${revisionPath}/reforecast`)).status).toBe(403) // no designs:view (shared/utils/roles.ts)
    expect((await stranger.get(`${revisionPath}/reforecast`)).status).toBe(404)
    await s.as.admin.patch(`${base}/${pairId}`, PAIR)
  })

  it('archived entries leave the forecast; restoring brings them back', async () => {
    expect((await s.as.admin.post(`${base}/${oilId}/archive`, { archived: true })).json.archived).toBe(true)
    expect((await s.as.designer.post(`/api/v1/forecast?lab=${s.lab.id}`, { document: labDocument() })).status).toBe(400)
    expect((await s.as.admin.post(`${base}/${oilId}/archive`, { archived: false })).json.archived).toBe(false)
    expect((await s.as.designer.post(`/api/v1/forecast?lab=${s.lab.id}`, { document: labDocument() })).status).toBe(200)
  })

  it('a lab process sets the design rules of a new design', async () => {
    const proc = await s.as.admin.post(base, {
      kind: 'process',
      key: 'coarse',
      name: 'Coarse film mask',
      material: 'PDMS',
      minFeature: 150,
      minGap: 150,
      minDepth: 5,
      maxDepth: 250,
      maxWidthToDepth: 20,
      maxWallDepthToWidth: 4,
      portEdgeDistance: 1000,
      portSpacing: 1000,
      bondPressureLimitMbar: 2000,
      source: 'measured in our lab',
    })
    expect(proc.status, JSON.stringify(proc.json)).toBe(201)
    const built = await s.as.designer.post(`/api/labs/${s.lab.id}/designs`, {
      name: 'Coarse',
      document: fixtureDocument(),
    })
    const coarse = await s.as.designer.post(`/api/labs/${s.lab.id}/designs`, {
      name: 'Coarse',
      processId: 'lab-coarse',
      document: fixtureDocument(),
    })
    expect(coarse.status, JSON.stringify(coarse.json)).toBe(201)
    const a = (await s.as.designer.get(`/api/labs/${s.lab.id}/revisions/${built.json.revisionId}`)).json.summary
    const b = (await s.as.designer.get(`/api/labs/${s.lab.id}/revisions/${coarse.json.revisionId}`)).json.summary
    expect(b.processId).toBe('lab-coarse')
    expect(b.library.process).toMatchObject({ origin: 'lab', values: { minFeature: 150 } })
    expect(b.findings.errors).toBeGreaterThan(a.findings.errors) // 50–100 µm channels under a 150 µm smallest feature
    const unknown = await s.as.designer.post(`/api/labs/${s.lab.id}/designs`, {
      name: 'Nope',
      processId: 'lab-nothing',
    })
    expect(unknown.status).toBe(400)
  })
})

describe('starter chips', () => {
  for (const starter of ['t-junction', 'flow-focusing', 'step-emulsifier'] as const) {
    it(`${starter}: a new design from the starter forecasts without a problem`, async () => {
      const res = await s.as.designer.post(`/api/labs/${s.lab.id}/designs`, { name: `Starter ${starter}`, starter })
      expect(res.status, JSON.stringify(res.json)).toBe(201)
      const summary = (await s.as.designer.get(`/api/labs/${s.lab.id}/revisions/${res.json.revisionId}`)).json.summary
      expect(summary.forecastError).toBeNull()
      expect(summary.findings.errors).toBe(0)
      expect(summary.junctionKinds).toEqual([
        { 't-junction': 't-junction', 'flow-focusing': 'flow-focusing', 'step-emulsifier': 'step-nozzle' }[starter],
      ])
      expect(summary.junctions[0].dropletDiameterUm).toBeGreaterThan(0)
    })
  }
})
