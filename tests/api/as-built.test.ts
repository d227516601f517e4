// As-built reports over real HTTP, PostgreSQL and the fake S3: the fab records measured depths and widths, the
// forecast is recomputed on the as-built chip beside the drawn one, files are checked on their bytes, the
// designer hears of it by e-mail.
import { describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import { labWithDesign } from '../support/designs'
import { releasedOrder } from '../support/orders'
import { mailTo } from '../support/mail'

async function emailOf(labId: string, role: string) {
  const client = new pg.Client({ connectionString: inject('databaseUrl') })
  await client.connect()
  try {
    return (
      await client.query<{ email: string }>(
        'select u.email from users u join memberships m on m.user_id = u.id where m.lab_id = $1 and m.role = $2',
        [labId, role],
      )
    ).rows[0]!.email
  } finally {
    await client.end()
  }
}

function multipart(field: string, fileName: string, content: string) {
  const boundary = `dw${Math.random().toString(16).slice(2)}`
  const body = `--${boundary}\r\nContent-Disposition: form-data; name="${field}"; filename="${fileName}"\r\nContent-Type: application/octet-stream\r\n\r\n${content}\r\n--${boundary}--\r\n`
  return { body, headers: { 'content-type': `multipart/form-data; boundary=${boundary}` } }
}

describe('as-built reports (real server, PostgreSQL, fake S3)', () => {
  it('the fab records depths and widths; the as-built forecast sits beside the drawn one and the designer gets an e-mail', async () => {
    const c = await labWithDesign()
    const { revisionId } = await releasedOrder(c)
    const base = `/api/labs/${c.lab.id}/revisions/${revisionId}/as-built`
    const before = (await c.as.designer.get(base)).json
    expect(before.asBuilt).toBeNull()
    expect(before.measurable.map((m: { elementId: string; field: string }) => `${m.elementId}.${m.field}`)).toContain(
      'tj-1.mainWidth',
    )
    // 50 µm drawn, 40 µm made: a shallower squeezing T-junction makes smaller plugs and needs more pressure.
    const recorded = await c.as.fabricator.post(base, {
      depths: [{ layerId: 'ch50', depthUm: 40 }],
      widths: [{ elementId: 'tj-1', field: 'mainWidth', widthUm: 92 }],
      note: 'Stylus profilometer, 3 traces',
    })
    expect(recorded.status, JSON.stringify(recorded.json)).toBe(201)
    const seen = (await c.as.designer.get(base)).json
    expect(seen.asBuilt).toMatchObject({
      depths: [{ layerId: 'ch50', depthUm: 40 }],
      note: 'Stylus profilometer, 3 traces',
    })
    const diameter = seen.asBuilt.changes.find((x: { what: string }) => x.what === 'droplet-diameter')
    expect(diameter.designed).toBe(before.designed.junctions[0].dropletDiameterUm)
    expect(diameter.asBuilt).toBeLessThan(diameter.designed)
    const pressure = seen.asBuilt.changes.find((x: { what: string }) => x.what === 'inlet-pressure')
    // A shallow channel's resistance goes as 1/(w h³) (Bruus 2008, Theoretical Microfluidics, eq. 4.34): 50→40 µm is ≈ ×2 at fixed flow.
    expect(pressure.asBuilt / pressure.designed).toBeGreaterThan(1.5)
    expect(pressure.exceeds).toBe(true)
    const designer = await emailOf(c.lab.id, 'designer')
    await expect
      .poll(() => mailTo(designer).some(m => m.subject.startsWith('As-built recorded: "Released')), { timeout: 20_000 })
      .toBe(true)
    const mail = mailTo(designer).find(m => m.subject.startsWith('As-built recorded'))!
    // In people's words: the inlet and the operating point by their names (the fixture's "op-1" is "Cells in 40 um drops").
    expect(mail.text).toMatch(
      /Pressure at inlet “oil-in”, operating point “Cells in 40 um drops”: [\d.\u202F]+ → [\d.\u202F]+ mbar \(\+\d+ %\) — beyond the method's uncertainty/,
    )
    expect(mail.text).toMatch(
      /Droplet diameter at T-junction “tj-1”, operating point “Cells in 40 um drops”: [\d.]+ → [\d.]+ µm \(−\d+ %\)/,
    )
    expect(mail.text).not.toContain('op-1')
    expect(seen.asBuilt.changes.find((x: { what: string }) => x.what === 'inlet-pressure').label).toBe(
      'Pressure at inlet “oil-in”, operating point “Cells in 40 um drops”',
    )
  }, 60_000)

  it('attaches a profilometer CSV, refuses other bytes whatever their name, and names bad measurements', async () => {
    const c = await labWithDesign()
    const { revisionId } = await releasedOrder(c)
    const base = `/api/labs/${c.lab.id}/revisions/${revisionId}/as-built`
    const unknownLayer = await c.as.fabricator.post(base, { depths: [{ layerId: 'deep', depthUm: 40 }] })
    expect(unknownLayer.status).toBe(400)
    expect(unknownLayer.json.data.issues[0]).toEqual({
      path: 'depths.0.layerId',
      message: 'No layer "deep" on this chip (its layers: ch50)',
    })
    expect(
      (await c.as.fabricator.post(base, { depths: [{ layerId: 'ch50', depthUm: -3 }] })).json.data.issues[0].message,
    ).toBe('Measured depth must be > 0 µm')
    // A size the chip schema refuses once applied (found by the fuzz suite: it was a 500) names the document field.
    const tiny = await c.as.fabricator.post(base, {
      widths: [{ elementId: 'tj-1', field: 'mainWidth', widthUm: 0.001 }],
    })
    expect(tiny.status).toBe(400)
    expect(tiny.json.data.issues[0]).toEqual({
      path: 'document.components.0.mainWidth',
      message: 'As built, T-junction main width must be at least 0.01 µm',
    })
    const { asBuiltId } = (await c.as.fabricator.post(base, { depths: [{ layerId: 'ch50', depthUm: 49.2 }] })).json
    const csv = multipart('file', 'trace.csv', 'x_um,height_um\n0,0.1\n10,49.1\n20,49.3\n')
    const up = await c.as.fabricator.request('POST', `${base}/${asBuiltId}/files`, csv.body, { headers: csv.headers })
    expect(up.status, JSON.stringify(up.json)).toBe(201)
    expect(up.json).toMatchObject({ contentType: 'text/csv', fileName: 'trace.csv' })
    const pdf = multipart('file', 'trace.csv', '%PDF-1.4\n%âãÏÓ\n1 0 obj\n<<>>\nendobj\n')
    const refused = await c.as.fabricator.request('POST', `${base}/${asBuiltId}/files`, pdf.body, {
      headers: pdf.headers,
    })
    expect(refused.status).toBe(415)
    expect(refused.json.message).toMatch(/"trace\.csv" is a PDF file/)
    const files = (await c.as.designer.get(base)).json.asBuilt.files
    expect(files).toHaveLength(1)
    const back = await c.as.designer.get(`${base}/${asBuiltId}/files/${files[0].id}`)
    expect(back.status).toBe(200)
    expect(String(back.json)).toContain('10,49.1')
    // A reviewer neither reports for the fab nor records measurements; another lab sees nothing.
    expect((await c.as.reviewer.post(base, { depths: [{ layerId: 'ch50', depthUm: 49 }] })).status).toBe(403)
    const other = await labWithDesign()
    expect((await other.as.fabricator.get(`/api/labs/${other.lab.id}/revisions/${revisionId}/as-built`)).status).toBe(
      404,
    )
  }, 60_000)
})
