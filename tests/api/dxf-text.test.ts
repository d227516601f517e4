import DxfParser from 'dxf-parser'
import { describe, expect, it } from 'vitest'
import { labWithDesign } from '../support/designs'

// The DXF route writes text as closed outlines by default and as TEXT entities with ?text=font (issue 16 item 11).
type Entity = { type: string; layer: string; shape?: boolean; text?: string }
const entities = (body: unknown) =>
  (new DxfParser().parseSync(String(body)) as unknown as { entities: Entity[] }).entities

describe('mask DXF text option (real server, real PostgreSQL)', () => {
  it('outlines by default, TEXT entities with ?text=font, and a bad value is a 400 in words', async () => {
    const { lab, as, revisionId } = await labWithDesign()
    const base = `/api/labs/${lab.id}/revisions/${revisionId}/dxf`

    const outlined = await as.designer.get(base)
    expect(outlined.status).toBe(200)
    const es = entities(outlined.json)
    expect(es.filter(e => e.type === 'TEXT' || e.type === 'MTEXT')).toHaveLength(0)
    const loops = es.filter(e => e.layer === 'TEXT')
    expect(loops.length).toBeGreaterThan(20)
    expect(loops.every(e => e.type === 'LWPOLYLINE' && e.shape === true)).toBe(true)

    const font = await as.designer.get(`${base}?text=font&mirror=true`)
    expect(font.status).toBe(200)
    const texts = entities(font.json)
      .filter(e => e.type === 'TEXT')
      .map(e => e.text)
    expect(texts).toContain('Revision: r1')
    expect(entities(font.json).filter(e => e.layer === 'TEXT' && e.type === 'LWPOLYLINE')).toHaveLength(0)

    const bad = await as.designer.get(`${base}?text=comic-sans`)
    expect(bad.status).toBe(400)
    expect(bad.json.message).toContain('Text must be "outline" (letters drawn as shapes) or "font" (DXF text entities)')
  })
})
