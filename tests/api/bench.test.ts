// Bench runs against the built server, PostgreSQL and the local fake S3: typed, CSV and micrograph runs, the
// user's exclusions, the lab's calibration, the forecast switch, and who reaches what (404 for fabricators and
// other labs, 403 for roles that may not record, 415 for a renamed program, 413 above the upload limit).
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient } from '../support/api'
import { labWithDesign } from '../support/designs'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { dropsPng } from '../support/micrograph'

type Setup = Awaited<ReturnType<typeof labWithDesign>>
let s: Setup
let base: string
let stranger: ApiClient

async function upload(
  client: ApiClient,
  path: string,
  bytes: Uint8Array,
  name: string,
  fields: Record<string, string>,
) {
  const form = new FormData()
  form.set('image', new Blob([bytes as Uint8Array<ArrayBuffer>]), name)
  for (const [k, v] of Object.entries(fields)) form.set(k, v)
  const headers: Record<string, string> = { cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') }
  const res = await fetch(client.baseURL + path, { method: 'POST', body: form, headers })
  const text = await res.text()
  return { status: res.status, json: text ? JSON.parse(text) : null }
}

beforeAll(async () => {
  s = await labWithDesign()
  base = `/api/labs/${s.lab.id}`
  const other = await makeLab(['designer'])
  stranger = await new ApiClient().signIn(other.people[0]!.email, TEST_PASSWORD)
})

describe('bench runs', () => {
  it('records a typed run with its statistics and the forecast it is compared with', async () => {
    const res = await s.as.experimenter.post(`${base}/revisions/${s.revisionId}/bench-runs`, {
      source: 'typed',
      values: [0.05, 0.052, 0.051, 0.049],
      unit: 'mm',
      operatingPointId: 'op-1',
      notes: 'first chip',
    })
    expect(res.status, JSON.stringify(res.json)).toBe(201)
    expect(res.json.count).toBe(4)
    // mean 50.5 µm, sample SD √(5/3) = 1.2910 µm (computed by hand: deviations −0.5, 1.5, 0.5, −1.5)
    expect(res.json.meanUm).toBeCloseTo(50.5, 9)
    expect(res.json.sdUm).toBeCloseTo(Math.sqrt(5 / 3), 9)
    expect(res.json.predicted?.kind).toBe('t-junction')
    expect(res.json.predicted.diameterUm).toBeGreaterThan(0)
    expect(res.json.relativeError).toBeCloseTo(
      (50.5 - res.json.predicted.diameterUm) / res.json.predicted.diameterUm,
      9,
    )
  })

  it('imports nothing from a CSV with a bad row, and names the row', async () => {
    const before = await s.as.designer.get(`${base}/revisions/${s.revisionId}/bench-runs`)
    const rows = [
      'drop,diameter',
      ...Array.from({ length: 15 }, (_, i) => `${i + 1},${50 + i * 0.1}`),
      '16,abc',
      '17,51',
    ]
    const res = await s.as.designer.post(`${base}/revisions/${s.revisionId}/bench-runs`, {
      source: 'csv',
      csv: { text: rows.join('\n'), column: 'diameter', unit: 'um' },
    })
    expect(res.status).toBe(400)
    expect(res.json.message).toContain('row 17: "abc" is not a number')
    const after = await s.as.designer.get(`${base}/revisions/${s.revisionId}/bench-runs`)
    expect(after.json.runs.length).toBe(before.json.runs.length)
  })

  it('takes a CSV as a text/csv body with the column and unit in the query', async () => {
    const csv = 'id;d_um\n'.replace(';', ',') + ['1,60.5', '2,61.5', '3,61'].join('\n')
    const res = await s.as.designer.request(
      'POST',
      `${base}/revisions/${s.revisionId}/bench-runs?column=d_um&unit=um&operatingPointId=op-1`,
      csv,
      { headers: { 'content-type': 'text/csv' } },
    )
    expect(res.status, JSON.stringify(res.json)).toBe(201)
    expect(res.json.source).toBe('csv')
    expect(res.json.count).toBe(3)
    expect(res.json.meanUm).toBeCloseTo(61, 9)
  })

  it('measures an uploaded micrograph, keeps the file in storage, and lets the user exclude a detection', async () => {
    const run = await s.as.designer.post(`${base}/revisions/${s.revisionId}/bench-runs`, {
      source: 'micrograph',
      operatingPointId: 'op-1',
    })
    expect(run.status).toBe(201)
    const { png, drops } = await dropsPng(14, 40)
    const res = await upload(s.as.designer, `${base}/bench-runs/${run.json.id}/micrographs`, png, 'drops.png', {
      umPerPx: '0.5',
    })
    expect(res.status, JSON.stringify(res.json)).toBe(201)
    const accepted = res.json.drops.filter((d: { accepted: boolean }) => d.accepted)
    expect(accepted.length).toBe(drops.length)
    const truth = (drops.reduce((a, d) => a + d.diameter, 0) / drops.length) * 0.5
    expect(Math.abs(res.json.summary.mean - truth) / truth).toBeLessThan(0.02)

    const micrographId = res.json.micrograph.id
    const file = await fetch(
      `${s.as.designer.baseURL}${base}/bench-runs/${run.json.id}/micrographs/${micrographId}/file?variant=original`,
      { headers: { cookie: [...s.as.designer.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } },
    )
    expect(file.status).toBe(200)
    expect(Buffer.from(await file.arrayBuffer()).equals(Buffer.from(png))).toBe(true)
    const thumb = await fetch(
      `${s.as.designer.baseURL}${base}/bench-runs/${run.json.id}/micrographs/${micrographId}/file?variant=thumbnail`,
      { headers: { cookie: [...s.as.designer.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } },
    )
    expect(thumb.headers.get('content-type')).toBe('image/jpeg')

    const excluded = await s.as.designer.patch(`${base}/bench-runs/${run.json.id}/micrographs/${micrographId}`, {
      excluded: [accepted[0].id],
    })
    expect(excluded.status).toBe(200)
    const after = await s.as.designer.get(`${base}/bench-runs/${run.json.id}`)
    expect(after.json.count).toBe(drops.length - 1)

    // Who reaches the files: a fabricator of the lab and a member of another lab get 404, never the bytes.
    for (const client of [s.as.fabricator, stranger]) {
      const path =
        client === stranger
          ? `${base}/bench-runs/${run.json.id}/micrographs/${micrographId}/file`
          : `${base}/bench-runs/${run.json.id}/micrographs/${micrographId}/file`
      const r = await client.get(path)
      expect(r.status).toBe(404)
      expect((await client.get(`${base}/bench-runs/${run.json.id}`)).status).toBe(404)
      expect((await client.get(`${base}/revisions/${s.revisionId}/bench-runs`)).status).toBe(404)
    }
    // A reviewer sees the results but may not record them.
    expect((await s.as.reviewer.get(`${base}/bench-runs/${run.json.id}`)).status).toBe(200)
    expect(
      (
        await upload(s.as.reviewer, `${base}/bench-runs/${run.json.id}/micrographs`, png, 'drops.png', {
          umPerPx: '0.5',
        })
      ).status,
    ).toBe(403)
  })

  it('refuses a renamed program as photo.png with a clear message, and an upload over the limit with 413', async () => {
    const run = await s.as.designer.post(`${base}/revisions/${s.revisionId}/bench-runs`, { source: 'micrograph' })
    const exe = new Uint8Array(4096)
    exe.set([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00, 0x04, 0x00, 0x00, 0x00, 0xff, 0xff])
    exe.set([0x50, 0x45, 0, 0], 0x80)
    exe[0x3c] = 0x80
    const res = await upload(s.as.designer, `${base}/bench-runs/${run.json.id}/micrographs`, exe, 'photo.png', {
      umPerPx: '0.8',
    })
    expect(res.status).toBe(415)
    expect(res.json.message).toMatch(/"photo.png" is .*whatever its name says: upload a PNG, JPEG or TIFF micrograph/)
    const huge = new Uint8Array(26 * 1024 * 1024)
    const big = await upload(s.as.designer, `${base}/bench-runs/${run.json.id}/micrographs`, huge, 'huge.png', {
      umPerPx: '0.8',
    })
    expect(big.status).toBe(413)
  })

  it('fits the lab calibration with its interval and switches a design to the calibrated forecast and back', async () => {
    const cal = await s.as.designer.get(`${base}/calibrations?designId=${s.designId}`)
    expect(cal.status).toBe(200)
    // The fixture chip's forecast is in dripping at op-1: its runs get their own correction, not Garstecki's α.
    const tj = cal.json.calibrations.find((c: { kind: string }) => c.kind === 't-junction/dripping')
    expect(tj, JSON.stringify(cal.json)).toBeTruthy()
    expect(tj.runs).toBeGreaterThanOrEqual(2)
    expect(tj.fit.interval95[0]).toBeLessThan(tj.fit.value)
    expect(tj.fit.interval95[1]).toBeGreaterThan(tj.fit.value)
    expect(cal.json.design.mode).toBe('model')
    const on = await s.as.designer.request('PUT', `${base}/calibrations/forecast-mode`, {
      designId: s.designId,
      mode: 'lab-calibrated',
    })
    expect(on.status).toBe(200)
    expect((await s.as.designer.get(`${base}/calibrations?designId=${s.designId}`)).json.design.mode).toBe(
      'lab-calibrated',
    )
    await s.as.designer.request('PUT', `${base}/calibrations/forecast-mode`, { designId: s.designId, mode: 'model' })
    expect((await s.as.designer.get(`${base}/calibrations?designId=${s.designId}`)).json.design.mode).toBe('model')
    expect((await stranger.get(`${base}/calibrations`)).status).toBe(404)
    expect((await s.as.fabricator.get(`${base}/calibrations`)).status).toBe(404)
  })
})

describe('the forecast a run is compared with', () => {
  it('is recomputed at the flow ratio typed at the bench for a T-junction', async () => {
    const design = await s.as.designer.post(`${base}/revisions/${s.revisionId}/bench-runs`, {
      source: 'typed',
      values: [50],
      operatingPointId: 'op-1',
    })
    const ratio = design.json.predicted.forecastFlowRatio
    const typed = await s.as.designer.post(`${base}/revisions/${s.revisionId}/bench-runs`, {
      source: 'typed',
      values: [50],
      operatingPointId: 'op-1',
      conditions: {
        continuousFlow: { value: 10, unit: 'uL/min' },
        dispersedFlow: { value: 10 * ratio * 2, unit: 'uL/min' },
      },
    })
    expect(typed.status).toBe(201)
    expect(typed.json.predicted.flowRatio).toBeCloseTo(ratio * 2, 9)
    expect(typed.json.predicted.atBenchFlows).toBe(true)
    // Twice the dispersed flow in squeezing makes a longer plug, so a larger sphere-equivalent drop.
    expect(typed.json.predicted.diameterUm).toBeGreaterThan(design.json.predicted.diameterUm * 1.05)
  })

  it('is recomputed at a pressure and a temperature typed at the bench, and refuses a flow and a pressure for one phase', async () => {
    const design = (
      await s.as.designer.post(`${base}/revisions/${s.revisionId}/bench-runs`, {
        source: 'typed',
        values: [50],
        operatingPointId: 'op-1',
      })
    ).json.predicted
    const pressed = await s.as.designer.post(`${base}/revisions/${s.revisionId}/bench-runs`, {
      source: 'typed',
      values: [50],
      operatingPointId: 'op-1',
      conditions: { dispersedPressureMbar: 400, temperatureC: 35 },
    })
    expect(pressed.status, JSON.stringify(pressed.json)).toBe(201)
    expect(pressed.json.predicted.atBenchFlows).toBe(true)
    expect(pressed.json.predicted.forecastFlowRatio).toBeCloseTo(design.forecastFlowRatio, 9)
    expect(pressed.json.predicted.flowRatio).not.toBeCloseTo(design.flowRatio, 3)
    const both = await s.as.designer.post(`${base}/revisions/${s.revisionId}/bench-runs`, {
      source: 'typed',
      values: [50],
      conditions: { dispersedFlow: { value: 2, unit: 'uL/min' }, dispersedPressureMbar: 40 },
    })
    expect(both.status).toBe(400)
    expect(both.json.message).toContain('Give the dispersed phase its flow or its pressure, not both')
  })

  it("the design's own forecast in the calibration answer is the revision's, not a run's at its bench flows", async () => {
    const revision = (await s.as.designer.get(`${base}/revisions/${s.revisionId}`)).json
    const cal = (await s.as.designer.get(`${base}/calibrations?designId=${s.designId}`)).json
    const junction = cal.design.junctions.find(
      (j: { junctionId: string }) => j.junctionId === revision.summary.junctions[0].id,
    )
    expect(junction.modelDiameterUm).toBeCloseTo(revision.summary.junctions[0].dropletDiameterUm, 9)
  })
})
