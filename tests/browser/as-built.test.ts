// The as-built report as people make it: the fabricator opens the released revision's as-built page, records a
// depth and a width picked on the drawing, attaches a profilometer CSV; the designer finds the as-built beside the
// design from the revision page, gets an e-mail, and downloads the fab sheet as a PDF.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, memberEmails, shot, signedInPage } from '../support/browser'
import { labWithDesign } from '../support/designs'
import { TEST_PASSWORD } from '../support/factory'
import { mailTo } from '../support/mail'
import { releasedOrder } from '../support/orders'
import { worldOnPage } from '../support/canvas'

let browser: Browser
let c: Awaited<ReturnType<typeof labWithDesign>>
let revisionId: string
let emails: Record<string, string>
beforeAll(async () => {
  browser = await launch()
  c = await labWithDesign()
  revisionId = (await releasedOrder(c)).revisionId
  emails = await memberEmails(c.as.admin, c.lab.id)
}, 120_000)
afterAll(async () => {
  await browser?.close()
})

const as = (role: string): Promise<Page> => signedInPage(browser, emails[role]!, TEST_PASSWORD)

/** Screen point of a world point (µm) on the fixture chip, through the viewer's own view. */
const at = (page: Page, x: number, y: number) => worldOnPage(page, '[data-test="viewer-canvas"]', x, y)

describe('the as-built report in the browser (real Chromium, server, PostgreSQL, fake S3 and SMTP)', () => {
  it('fabricator records a depth, a picked width and a CSV; the designer sees the comparison, the mail and the PDF', async () => {
    const fab = await as('fabricator')
    const base = `/api/labs/${c.lab.id}/revisions/${revisionId}/as-built`
    await fab.goto(`/labs/${c.lab.id}/revisions/${revisionId}/as-built`)
    await hydrated(fab)
    await fab.waitForSelector('[data-test="viewer-canvas"] canvas')

    // A bad depth is refused beside its field and stays typed.
    await fab.fill('[data-test="depth-ch50"]', '-3')
    await fab.click('[data-test="as-built-record"]')
    expect(await fab.textContent('[data-test="depth-error-ch50"]')).toBe('Measured depth must be > 0 µm')
    expect(await fab.inputValue('[data-test="depth-ch50"]')).toBe('-3')
    expect((await c.as.fabricator.get(base)).json.asBuilt).toBeNull()

    // Pick the T-junction on the drawing: it is named, not shown by its id alone, with its width fields.
    const p = await at(fab, 5000, 3000)
    await fab.mouse.click(p.x, p.y)
    expect(await fab.textContent('[data-test="width-picked"]')).toContain('T-junction')
    const fields = await fab.locator('[data-test="width-field"] option').allTextContents()
    expect(fields.map(f => f.trim()).sort()).toEqual([
      'Main channel width (drawn 100 µm)',
      'Side inlet width (drawn 50 µm)',
    ])
    await fab.selectOption('[data-test="width-field"]', 'inletWidth')
    await fab.fill('[data-test="width-value"]', '47')
    await fab.click('[data-test="width-add"]')
    await fab.selectOption('[data-test="width-field"]', 'mainWidth')
    await fab.fill('[data-test="width-value"]', '0')
    await fab.click('[data-test="width-add"]')
    expect(await fab.textContent('[data-test="width-error"]')).toBe('Measured width must be > 0 µm')
    await fab.fill('[data-test="width-value"]', '108')
    await fab.click('[data-test="width-add"]')
    await expect.poll(() => fab.locator('[data-test="width-list"] li').count()).toBe(2)
    // Removable before it is sent.
    await fab.click('[data-test="width-remove-0"]')
    const rows = await fab.locator('[data-test="width-list"] li').allTextContents()
    expect(rows).toHaveLength(1)
    expect(rows[0]).toMatch(/T-junction.*main channel width: 108 µm \(drawn 100 µm\)/)

    await fab.fill('[data-test="depth-ch50"]', '55')
    await fab.fill('[data-test="as-built-note"]', 'Stylus profilometer, 3 traces')
    await fab.click('[data-test="as-built-record"]')
    await fab.waitForSelector('[data-test="as-built-changes"]')
    const recorded = (await c.as.fabricator.get(base)).json.asBuilt
    expect(recorded).toMatchObject({
      depths: [{ layerId: 'ch50', depthUm: 55 }],
      widths: [{ elementId: 'tj-1', field: 'mainWidth', widthUm: 108 }],
      note: 'Stylus profilometer, 3 traces',
    })
    // The date is written for people, not as an ISO stamp.
    expect(await fab.textContent('[data-test="as-built-recorded"]')).not.toMatch(/\d{4}-\d{2}-\d{2}/)

    // Files: a PDF named .csv is refused in words; the profilometer CSV is attached and listed.
    await fab.setInputFiles('[data-test="as-built-file-input"]', {
      name: 'trace.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('%PDF-1.4\n%âãÏÓ\n1 0 obj\n<<>>\nendobj\n', 'latin1'),
    })
    await fab.click('[data-test="as-built-attach"]')
    await expect
      .poll(() => fab.textContent('[data-test="as-built-file-error"]').catch(() => ''))
      .toMatch(/"trace\.csv" is a PDF file/)
    await fab.setInputFiles('[data-test="as-built-file-input"]', {
      name: 'trace.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('x_um,height_um\n0,0.1\n10,54.9\n20,55.1\n'),
    })
    await fab.click('[data-test="as-built-attach"]')
    await expect.poll(() => fab.locator('[data-test="as-built-file"]').allTextContents()).toEqual(['trace.csv'])
    await shot(fab, 'as-built-1-recorded')

    // The designer: the revision page links to the as-built page, which shows the comparison by element name.
    const designer = await as('designer')
    await designer.goto(`/labs/${c.lab.id}/revisions/${revisionId}`)
    await hydrated(designer)
    await designer.click('[data-test="as-built-link"]')
    await designer.waitForURL(/\/as-built$/)
    await designer.waitForSelector('[data-test="as-built-changes"]')
    const table = (await designer.textContent('[data-test="as-built-changes"]'))!
    expect(table).toMatch(/Droplet diameter at T-junction/)
    expect(table).toMatch(/\d µm/)
    expect(table).toMatch(/mbar/)
    expect(await designer.locator('[data-test="as-built-file"]').allTextContents()).toEqual(['trace.csv'])
    await expect
      .poll(() => mailTo(emails.designer!).filter(m => m.subject.startsWith('As-built recorded')).length, {
        timeout: 30_000,
      })
      .toBe(1)

    // The fab sheet PDF downloads from the browser.
    await designer.goto(`/labs/${c.lab.id}/revisions/${revisionId}/fab-sheet`)
    await hydrated(designer)
    const href = (await designer.getAttribute('[data-test="fab-sheet-pdf"]', 'href'))!
    const [download] = await Promise.all([
      designer.waitForEvent('download'),
      designer.click('[data-test="fab-sheet-pdf"]'),
    ])
    const path = await download.path()
    const { readFileSync } = await import('node:fs')
    expect(readFileSync(path!).subarray(0, 4).toString('latin1')).toBe('%PDF')
    const res = await designer.request.get(href)
    expect(res.status()).toBe(200)
    expect(res.headers()['content-type']).toBe('application/pdf')
    expect((await res.body()).subarray(0, 4).toString('latin1')).toBe('%PDF')
  }, 180_000)
})
