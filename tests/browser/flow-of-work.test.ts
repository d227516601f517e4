// Issue 16 item 9, the flow of work as a designer and a reviewer meet it: archiving asks first and is offered only
// to those who may archive; a save confirms "Saved as r2" and empties the message box; the editor's heading is the
// design's own name (also after a duplicate); Enter in a number field hands the keyboard back to the drawing; the
// Import JSON error shows beside the control without moving the page; any revision can be duplicated; the
// revision list says which revision a branch came from.
import type { Browser, Page } from 'playwright-core'
import { writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, signInAs } from '../support/browser'
import { editorDoc } from '../support/editor'
import { ApiClient } from '../support/api'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
let designer: Page
const emails: Record<string, string> = {}
const lab = { lab: { id: '' }, designId: '', as: { designer: new ApiClient() } }
beforeAll(async () => {
  browser = await launch()
  const made = await makeLab(['designer', 'reviewer'])
  lab.lab.id = made.lab.id
  for (const p of made.people) emails[p.role] = p.email
  lab.as.designer = await new ApiClient().signIn(emails.designer!, TEST_PASSWORD)
  lab.designId = (await newDesign(lab.as.designer, 'Cell drops T-junction')).designId
  designer = await as('designer')
}, 120_000)
afterAll(async () => {
  await browser?.close()
})

async function as(role: 'designer' | 'reviewer'): Promise<Page> {
  const page = await newPage(browser)
  await page.setViewportSize({ width: 1440, height: 900 })
  await signInAs(page, emails[role]!, TEST_PASSWORD)
  await page.waitForURL(/\/labs\//)
  return page
}
const labId = () => lab.lab.id
async function newDesign(api: ApiClient, name: string) {
  const r = await api.post(`/api/labs/${labId()}/designs`, { name, document: fixtureDocument() })
  expect(r.status).toBe(201)
  return r.json as { designId: string; revisionId: string }
}
async function openEditor(page: Page, designId: string) {
  await page.goto(`/labs/${labId()}/designs/${designId}/edit`)
  await hydrated(page)
  await page.waitForSelector('[data-test="editor-canvas"] canvas')
}
const isArchived = async (designId: string) =>
  (await lab.as.designer.get(`/api/labs/${labId()}/designs/${designId}`)).json.design.archived as boolean

describe('flow of work', () => {
  it('archiving asks first, says what it does, and is offered only to those who may archive', async () => {
    const reviewer = await as('reviewer')
    await reviewer.goto(`/labs/${labId()}/designs/${lab.designId}`)
    await hydrated(reviewer)
    await reviewer.waitForSelector('[data-test="design-name"]')
    expect(await reviewer.locator('[data-test="archive-design"]').count()).toBe(0)
    await reviewer.context().close()

    const { designId } = await newDesign(lab.as.designer, 'Archive me')
    await designer.goto(`/labs/${labId()}/designs/${designId}`)
    await hydrated(designer)
    await designer.click('[data-test="archive-design"]')
    const dialog = designer.locator('[data-test="archive-confirm"]')
    await expect.poll(() => dialog.textContent()).toContain('read-only')
    expect(await dialog.textContent()).toContain('can be restored')
    expect(await isArchived(designId)).toBe(false)
    await designer.click('[data-test="archive-confirm-no"]')
    expect(await dialog.count()).toBe(0)
    expect(await isArchived(designId)).toBe(false)
    await designer.click('[data-test="archive-design"]')
    await designer.click('[data-test="archive-confirm-yes"]')
    await expect.poll(() => designer.locator('[data-test="design-name"]').textContent()).toContain('(archived)')
    expect(await isArchived(designId)).toBe(true)
  })

  it('a save says "Saved as r2" and empties the message box', async () => {
    const { designId } = await newDesign(lab.as.designer, 'Save confirmation')
    await openEditor(designer, designId)
    await designer.evaluate(() => (window as any).__dwEditor.store.select(['tj-1']))
    await designer.fill('[data-test="field-mainWidth"]', '90')
    await designer.press('[data-test="field-mainWidth"]', 'Tab')
    await expect.poll(() => designer.locator('[data-test="dirty-state"]').textContent()).toBe('unsaved changes')
    expect(await designer.locator('[data-test="saved-as"]').count()).toBe(0)
    await designer.fill('[data-test="save-message"]', 'Main channel 90 µm')
    await designer.click('[data-test="save"]')
    await expect.poll(() => designer.locator('[data-test="saved-as"]').innerText()).toBe('Saved as r2')
    expect(await designer.inputValue('[data-test="save-message"]')).toBe('')
  })

  it('Enter in a width field gives the keyboard back to the drawing, so R turns the selection', async () => {
    const { designId } = await newDesign(lab.as.designer, 'Keys after Enter')
    await openEditor(designer, designId)
    await designer.evaluate(() => (window as any).__dwEditor.store.select(['tj-1']))
    await designer.fill('[data-test="field-mainWidth"]', '80')
    await designer.press('[data-test="field-mainWidth"]', 'Enter')
    await expect.poll(async () => (await editorDoc(designer)).components[0].mainWidth).toBe(80)
    await expect
      .poll(() => designer.evaluate(() => document.activeElement?.getAttribute('data-test')))
      .toBe('editor-canvas')
    await designer.keyboard.press('r')
    await expect.poll(async () => (await editorDoc(designer)).components[0].rotation).toBe(90)
    expect(await designer.inputValue('[data-test="field-mainWidth"]')).toBe('80')
    // A refused value keeps the focus in the field, to be corrected.
    await designer.fill('[data-test="field-mainWidth"]', '-5')
    await designer.press('[data-test="field-mainWidth"]', 'Enter')
    await expect
      .poll(() => designer.evaluate(() => document.activeElement?.getAttribute('data-test')))
      .toBe('field-mainWidth')
  })

  it('the Import JSON error shows beside the control and the page does not move', async () => {
    const { designId } = await newDesign(lab.as.designer, 'Import refusal')
    await openEditor(designer, designId)
    // The side panel scrolled to its end once its lazy sections have loaded (its height no longer changes).
    const aside = designer.locator('[data-test="editor-side"]')
    await expect
      .poll(async () => {
        const h = await aside.evaluate(el => el.scrollHeight)
        await designer.waitForTimeout(300)
        return (await aside.evaluate(el => el.scrollHeight)) === h
      })
      .toBe(true)
    await aside.evaluate(el => {
      el.scrollTop = el.scrollHeight
    })
    const before = await designer.evaluate(() => window.scrollY)
    const control = (await designer.locator('[data-test="import-json-control"]').boundingBox())!
    const path = join(tmpdir(), `not-a-chip-${Date.now()}.json`)
    await writeFile(path, JSON.stringify({ version: 1, name: 'Half a chip', layers: [] }))
    // As a person does it: a click on the control opens the file dialog, the chosen file comes back to the input.
    const [chooser] = await Promise.all([
      designer.waitForEvent('filechooser'),
      designer.click('[data-test="import-json-control"]'),
    ])
    await chooser.setFiles(path)
    const error = designer.locator('[data-test="import-error"]')
    await expect.poll(() => error.count()).toBe(1)
    expect(await error.textContent()).not.toMatch(/document\.|\[\d+\]|expected \w+, received/)
    // Neither the page nor the panel moved: the window is where it was, and so is the control on the screen.
    expect(await designer.evaluate(() => window.scrollY)).toBe(before)
    const box = (await error.boundingBox())!
    const controlNow = (await designer.locator('[data-test="import-json-control"]').boundingBox())!
    expect(Math.abs(controlNow.y - control.y)).toBeLessThan(1)
    expect(Math.abs(box.y - (controlNow.y + controlNow.height))).toBeLessThan(40)
    // The working document is untouched.
    expect((await editorDoc(designer)).name).toBe(fixtureDocument().name)
  })

  it("any revision can be duplicated, and the editor of the copy is headed by the copy's name", async () => {
    const { designId, revisionId } = await newDesign(lab.as.designer, 'Source of copies')
    const r2 = await lab.as.designer.post(`/api/labs/${labId()}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: 'Second',
      document: { ...fixtureDocument(), name: 'Second document' },
    })
    expect(r2.status).toBe(201)
    await designer.goto(`/labs/${labId()}/revisions/${revisionId}`)
    await hydrated(designer)
    await designer.click('[data-test="duplicate-revision"]')
    await designer.fill('[data-test="duplicate-revision-form"] input', 'Copy of the first revision')
    await designer.click('[data-test="duplicate-revision-form"] button.btn-primary')
    await designer.waitForURL(url => /\/designs\/[^/]+$/.test(url.pathname) && !url.pathname.endsWith(designId))
    await hydrated(designer)
    await expect
      .poll(() => designer.locator('[data-test="design-origin"]').textContent())
      .toMatch(/Source of copies\s+revision\s+r1/)
    const copyId = new URL(designer.url()).pathname.split('/').pop()!
    const copy = (await lab.as.designer.get(`/api/labs/${labId()}/designs/${copyId}`)).json
    const doc = (await lab.as.designer.get(`/api/labs/${labId()}/revisions/${copy.design.latestRevisionId}`)).json
      .document
    expect(doc.name).toBe(fixtureDocument().name)
    await openEditor(designer, copyId)
    expect(await designer.locator('[data-test="editor-title"]').textContent()).toBe('Copy of the first revision')
  })

  it('the revision list says which revision a branch came from', async () => {
    const { designId, revisionId } = await newDesign(lab.as.designer, 'Branches')
    const r2 = await lab.as.designer.post(`/api/labs/${labId()}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: 'Straight on',
      document: fixtureDocument(),
    })
    expect(r2.status).toBe(201)
    const r3 = await lab.as.designer.post(`/api/labs/${labId()}/designs/${designId}/revisions`, {
      parentId: revisionId,
      message: 'Another way from r1',
      document: fixtureDocument(),
      branch: true,
    })
    expect(r3.status).toBe(201)
    await designer.goto(`/labs/${labId()}/designs/${designId}`)
    await hydrated(designer)
    expect(await designer.locator('[data-test="branch-r3"]').textContent()).toBe('branched from r1')
    expect(await designer.locator('[data-test="branch-r2"]').count()).toBe(0)
  })
})
