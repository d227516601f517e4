// The fab sheet PDF, read back with Debian's pdftotext (poppler-utils): depths, process, mask, approver, cautions.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, inject, it } from 'vitest'
import { labWithDesign } from '../support/designs'
import { releasedOrder } from '../support/orders'
import type { ApiClient } from '../support/api'

async function download(client: ApiClient, path: string) {
  const res = await fetch(inject('baseURL') + path, {
    headers: { cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
  })
  return {
    status: res.status,
    type: res.headers.get('content-type'),
    disposition: res.headers.get('content-disposition'),
    bytes: new Uint8Array(await res.arrayBuffer()),
  }
}

describe('fab sheet PDF (real server; pdftotext reads it back)', () => {
  it('carries the layer depths, the mask, the process, the approver, a scale bar and the cautions', async () => {
    const c = await labWithDesign()
    const { revisionId } = await releasedOrder(c, { maskMedium: 'chrome', maskPolarity: 'negative', quantity: 3 })
    const pdf = await download(c.as.fabricator, `/api/labs/${c.lab.id}/revisions/${revisionId}/fab-sheet.pdf`)
    expect(pdf.status).toBe(200)
    expect(pdf.type).toBe('application/pdf')
    expect(pdf.disposition).toMatch(/_r1_fab-sheet\.pdf"$/)
    expect(new TextDecoder().decode(pdf.bytes.slice(0, 5))).toBe('%PDF-')
    const file = join(mkdtempSync(join(tmpdir(), 'dw-pdf-')), 'sheet.pdf')
    writeFileSync(file, pdf.bytes)
    const text = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')
    expect(text).toContain('Channels: 50 µm deep (DXF layer CH-50um)') // the fixture's one layer (tests/fixtures/documents/t-junction-basic.json)
    expect(text).toMatch(/Film-mask soft lithography|soft lithography/i)
    expect(text).toContain('Chrome on glass; polarity: channels dark')
    expect(text).toContain('Smallest feature drawn: 50 µm wide')
    expect(text).toMatch(/approved by reviewer \d+ \w+ on \d{4}-\d{2}-\d{2}/)
    expect(text).toMatch(/order 1: 3 chips/)
    expect(text).toMatch(/2 mm \(drawn to scale; chip 10 mm × 7 mm\)/) // a fifth of 10 mm, rounded down to 1-2-5
    expect(text).toContain('Cautions')
    expect(text).toContain('pressurised chips and tubing can burst and spray')
    expect(text).toContain('Biological samples follow their biosafety level')
    // Fonts are embedded (IBM Plex Sans from @fontsource), not the viewer's stand-ins.
    const fonts = execFileSync('/usr/bin/pdffonts', [file], { encoding: 'utf8' })
    expect(fonts).toMatch(/IBMPlexSans/)
    expect(fonts).not.toMatch(/Helvetica/)
  })

  it('is 404 for a fabricator before the release, and for another lab', async () => {
    const c = await labWithDesign()
    expect(
      (await download(c.as.fabricator, `/api/labs/${c.lab.id}/revisions/${c.revisionId}/fab-sheet.pdf`)).status,
    ).toBe(404)
    expect(
      (await download(c.as.designer, `/api/labs/${c.lab.id}/revisions/${c.revisionId}/fab-sheet.pdf`)).status,
    ).toBe(200)
    const other = await labWithDesign()
    expect(
      (await download(other.as.admin, `/api/labs/${other.lab.id}/revisions/${c.revisionId}/fab-sheet.pdf`)).status,
    ).toBe(404)
  })
})
