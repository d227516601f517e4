// A mask DXF made by the "mask.dxf" background job over the real server, PostgreSQL and the fake S3: the export
// answers at once, is followed to "ready", and its file is byte for byte the DXF the direct route makes; another
// lab, or a fabricator on an unreleased revision, never reaches it (404); bad options are a 400 naming the field.
import DxfParser from 'dxf-parser'
import { describe, expect, it } from 'vitest'
import { planParallelChip } from '../../geometry/arrays'
import { labWithDesign } from '../support/designs'

const drawing = (text: unknown) =>
  (new DxfParser().parseSync(String(text)) as unknown as { entities: Array<Record<string, unknown>> }).entities.map(
    ({ handle: _h, ownerHandle: _o, ...rest }) => rest,
  )

describe('mask DXF as a background job', () => {
  it('makes the same file as the direct route, kept in storage, for the lab only', async () => {
    const c = await labWithDesign()
    const other = await labWithDesign()
    const created = await c.as.designer.post(`/api/labs/${c.lab.id}/designs`, {
      name: 'Array for the mask job',
      document: planParallelChip({ nozzles: 64 }).document,
    })
    expect(created.status).toBe(201)
    const base = `/api/labs/${c.lab.id}/revisions/${created.json.revisionId}`
    const started = await c.as.designer.post(`${base}/dxf-exports?mirror=true`)
    expect(started.status, JSON.stringify(started.json)).toBe(202)
    expect(['queued', 'making']).toContain(started.json.status)
    const at = `${base}/dxf-exports/${started.json.exportId}`
    await expect
      .poll(async () => (await c.as.designer.get(at)).json.status, { timeout: 30_000, interval: 200 })
      .toBe('ready')
    const ready = (await c.as.designer.get(at)).json
    expect(ready.fileUrl).toBe(`${at}/file`)
    expect(ready.filename).toMatch(/\.dxf$/)
    const file = await c.as.designer.get(ready.fileUrl)
    expect(file.status).toBe(200)
    expect(file.headers.get('content-disposition')).toBe(`attachment; filename="${ready.filename}"`)
    const direct = await c.as.designer.get(`${base}/dxf?mirror=true`)
    expect(direct.status).toBe(200)
    // The same drawing, read back with dxf-parser (an independent reader): every entity on every layer, equal but
    // for the handles (dxf-writer numbers them per worker thread, so two direct downloads differ there too).
    expect(drawing(file.json)).toEqual(drawing(direct.json))
    expect(drawing(file.json).length).toBeGreaterThan(64)
    expect(ready.bytes).toBe(Buffer.byteLength(file.json as string))
    // Another lab's people, with their own lab id or this one, get nothing.
    expect((await other.as.admin.get(at)).status).toBe(404)
    expect((await other.as.admin.get(`${at}/file`)).status).toBe(404)
    const foreign = `/api/labs/${other.lab.id}/revisions/${created.json.revisionId}/dxf-exports/${started.json.exportId}`
    expect((await other.as.admin.get(foreign)).status).toBe(404)
    // The fabricator of this lab does not see the unreleased revision, nor its export.
    expect((await c.as.fabricator.get(at)).status).toBe(404)
    expect((await c.as.fabricator.post(`${base}/dxf-exports`)).status).toBe(404)
  }, 60_000)

  it('refuses bad options with the field named, and an unknown export with 404', async () => {
    const c = await labWithDesign()
    const base = `/api/labs/${c.lab.id}/revisions/${c.revisionId}`
    const bad = await c.as.designer.post(`${base}/dxf-exports?text=bitmap`)
    expect(bad.status).toBe(400)
    expect(JSON.stringify(bad.json)).toContain('text')
    const unknown = await c.as.designer.get(`${base}/dxf-exports/00000000-0000-4000-8000-000000000000`)
    expect(unknown.status).toBe(404)
    expect((await c.as.designer.get(`${base}/dxf-exports/not-a-uuid`)).status).toBe(400)
  })
})
