// The chip editor as a designer uses it, in Chromium: place a T-junction by mouse, set sizes and a flow rate,
// read the forecast, undo and redo, save with a message, reopen; a save that lost a race to another tab; arrays,
// outline and marks; and a demo-like design edited, saved as a new revision, exported and imported back.
import type { Browser, Page } from 'playwright-core'
import { readFile } from 'node:fs/promises'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { labWithDesign, designerWithDesign } from '../support/designs'
import { at, editorPage } from '../support/editor'
import { TEST_PASSWORD } from '../support/factory'

let browser: Browser
let email = ''
let labId = ''
let designId = ''
beforeAll(async () => {
  browser = await launch()
  const made = await designerWithDesign('Editor story chip')
  email = made.email
  labId = made.labId
  designId = made.designId
})
afterAll(async () => {
  await browser?.close()
})

async function openEditor(page: Page) {
  await page.goto(`/labs/${labId}/designs/${designId}/edit`)
  await hydrated(page)
  await page.waitForSelector('[data-test="editor-canvas"] canvas')
}

/** Place a part by mouse at (x, y) µm and save with a message. */
async function placeAndSave(p: Page, tool: string, x: number, y: number, message: string) {
  await p.click(`[data-test="tool-${tool}"]`)
  const s = await at(p, x, y)
  await p.mouse.click(s.x, s.y)
  await p.fill('[data-test="save-message"]', message)
  await p.click('[data-test="save"]')
}
const diameter = (page: Page) => page.locator('[data-test="forecast-dropletDiameter"] td').nth(1).textContent()

describe('chip editor in Chromium', () => {
  let page: Page

  it('a designer opens the editor from the design page and places a T-junction by mouse', async () => {
    page = await newPage(browser)
    await signInAs(page, email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.goto(`/labs/${labId}/designs/${designId}`)
    await hydrated(page)
    await page.click('[data-test="edit-design"]')
    await page.waitForSelector('[data-test="editor-canvas"] canvas')
    await hydrated(page)
    await page.click('[data-test="tool-place:t-junction"]')
    const p = await at(page, 2500, 1500)
    await page.mouse.click(p.x, p.y)
    await expect.poll(() => page.locator('[data-test="inspector-id"]').textContent()).toBe('tj-2')
    await expect.poll(() => page.inputValue('[data-test="field-position.x"]')).toBe('2500')
  })

  it('sets widths in the inspector; a bad value shows the schema message and stays in the box', async () => {
    await page.fill('[data-test="field-mainWidth"]', '80')
    await page.press('[data-test="field-mainWidth"]', 'Enter')
    await page.fill('[data-test="field-inletWidth"]', '40')
    await page.press('[data-test="field-inletWidth"]', 'Enter')
    await page.fill('[data-test="field-armLength"]', '-5')
    await page.press('[data-test="field-armLength"]', 'Enter')
    await expect.poll(() => page.locator('[data-test="error-armLength"]').textContent()).toContain('must be > 0 µm')
    expect(await page.inputValue('[data-test="field-armLength"]')).toBe('-5')
    const doc = await page.evaluate(() =>
      (window as any).__dwEditor.store.doc.components.find((c: any) => c.id === 'tj-2'),
    )
    expect(doc).toMatchObject({ mainWidth: 80, inletWidth: 40, armLength: 300 })
  })

  it('selects the connected junction on the canvas, reads its diameter, changes a flow rate, undoes and redoes', async () => {
    const p = await at(page, 5000, 3000)
    await page.mouse.click(p.x, p.y)
    await expect.poll(() => page.locator('[data-test="inspector-id"]').textContent()).toBe('tj-1')
    await expect.poll(() => diameter(page)).toMatch(/µm$/)
    const before = await diameter(page)
    await page.waitForSelector('[data-test="plot-ratio"] svg path', { state: 'attached' })
    const pointBefore = await page.locator('[data-test="plot-current"]').textContent()
    await shot(page, 'editor-junction-selected')
    await page.fill('[data-test="inlet-value-water-in"]', '1')
    await page.press('[data-test="inlet-value-water-in"]', 'Tab')
    await expect.poll(() => diameter(page)).not.toBe(before)
    await expect.poll(() => page.locator('[data-test="plot-current"]').textContent()).not.toBe(pointBefore)
    expect(await page.locator('[data-test="plot-regime-map"] svg').count()).toBe(1)
    await page.locator('[data-test="plot-ratio"]').scrollIntoViewIfNeeded()
    await shot(page, 'editor-plots')
    const after = await diameter(page)
    expect(await page.getAttribute('[data-test="cmd-undo"]', 'title')).toBe('Undo inlet setting (Ctrl Z)')
    await page.click('[data-test="cmd-undo"]')
    expect(await page.getAttribute('[data-test="cmd-redo"]', 'title')).toBe('Redo inlet setting (Ctrl Shift Z)')
    await expect.poll(() => diameter(page)).toBe(before)
    await page.keyboard.press('Control+Shift+Z')
    await expect.poll(() => diameter(page)).toBe(after)
  })

  it('saves with a message; reopening shows the same design', async () => {
    await page.fill('[data-test="save-message"]', 'Second T-junction, slower water')
    await page.click('[data-test="save"]')
    await expect.poll(() => page.locator('[data-test="dirty-state"]').textContent()).toBe('saved')
    await page.reload()
    await hydrated(page)
    await page.waitForSelector('[data-test="editor-canvas"] canvas')
    const doc = await page.evaluate(() => (window as any).__dwEditor.store.doc)
    expect(doc.components.map((c: any) => c.id)).toEqual(['tj-1', 'tj-2'])
    expect(doc.operatingPoints[0].inlets.find((i: any) => i.portId === 'water-in').value).toBe(1)
    await page.goto(`/labs/${labId}/designs/${designId}`)
    await expect
      .poll(() => page.locator('[data-test="revisions-table"]').textContent())
      .toContain('Second T-junction, slower water')
  })

  it('a save that lost the race to a second tab offers reload or a branch, and keeps the edits', async () => {
    const second = await page.context().newPage()
    await openEditor(page)
    await openEditor(second)
    await hydrated(second)
    // The second tab saves first.
    await placeAndSave(second, 'place:y-junction', 8000, 1500, 'Y-junction from the other tab')
    await expect.poll(() => second.locator('[data-test="dirty-state"]').textContent()).toBe('saved')
    // This tab's save now conflicts.
    await placeAndSave(page, 'place:flow-focusing', 2500, 5500, 'Flow-focusing cross')
    await page.waitForSelector('[data-test="save-conflict"]')
    expect(await page.locator('[data-test="save-conflict"]').textContent()).toMatch(/no longer the latest/)
    expect(await page.inputValue('[data-test="save-message"]')).toBe('Flow-focusing cross')
    await shot(page, 'editor-conflict')
    await page.click('[data-test="conflict-branch"]')
    await expect.poll(() => page.locator('[data-test="dirty-state"]').textContent()).toBe('saved')
    // Now the second tab is behind: it reloads the latest, its edits kept in a local copy and offered back.
    await placeAndSave(second, 'place:step-nozzle', 8000, 5500, 'Step nozzle')
    await second.waitForSelector('[data-test="save-conflict"]')
    await second.click('[data-test="conflict-reload"]')
    await second.waitForSelector('[data-test="restore-prompt"]')
    const latest = await second.evaluate(() => (window as any).__dwEditor.store.doc.components.map((c: any) => c.id))
    expect(latest).toContain('ff-1')
    await second.click('[data-test="restore-take"]')
    const restored = await second.evaluate(() => (window as any).__dwEditor.store.doc.components.map((c: any) => c.id))
    expect(restored).toContain('step-1')
    await second.click('[data-test="save"]')
    await expect.poll(() => second.locator('[data-test="dirty-state"]').textContent()).toBe('saved')
    await second.close()
  })

  it('the keys overlay opens with ? and lists the tools', async () => {
    await page.locator('[data-test="editor-canvas"]').focus()
    await page.keyboard.press('?')
    await page.waitForSelector('[data-test="editor-help"]')
    expect(await page.locator('[data-test="editor-help"]').textContent()).toContain('Flow-focusing cross')
    await page.keyboard.press('Escape')
    await expect.poll(() => page.locator('[data-test="editor-help"]').count()).toBe(0)
  })

  it('builds 8 step nozzles on a manifold beside the chip from the array form, and one undo takes them away', async () => {
    const count = () =>
      page.evaluate(
        () => (window as any).__dwEditor.store.doc.components.filter((c: any) => c.kind === 'step-nozzle').length,
      )
    const before = await count()
    await page.click('[data-test="cmd-array"]')
    await page.fill('[data-test="array-count"]', '8')
    await page.fill('[data-test="array-pitch"]', '80')
    await page.click('[data-test="array-build"]')
    await expect.poll(count).toBe(before + 8)
    await expect.poll(() => page.locator('[data-test="array-form"]').count()).toBe(0)
    await shot(page, 'editor-array')
    await page.click('[data-test="cmd-undo"]')
    await expect.poll(count).toBe(before)
  })

  it('sets the chip outline in the inspector with nothing selected, and places an alignment cross by mouse', async () => {
    await page.keyboard.press('Escape')
    await page.waitForSelector('[data-test="outline-inspector"]')
    await page.fill('[data-test="field-outline.width"]', '12000')
    await page.press('[data-test="field-outline.width"]', 'Enter')
    await expect.poll(() => page.evaluate(() => (window as any).__dwEditor.store.doc.outline?.width)).toBe(12000)
    await page.fill('[data-test="field-outline.height"]', '0')
    await page.press('[data-test="field-outline.height"]', 'Enter')
    await expect
      .poll(() => page.locator('[data-test="error-outline.height"]').textContent())
      .toContain('must be > 0 µm')
    await page.click('[data-test="tool-mark"]')
    const p = await at(page, 500, 500)
    await page.mouse.click(p.x, p.y)
    await expect.poll(() => page.locator('[data-test="inspector-id"]').textContent()).toBe('mark-1')
    const mark = await page.evaluate(() =>
      (window as any).__dwEditor.store.doc.marks.find((m: any) => m.id === 'mark-1'),
    )
    expect(mark).toMatchObject({ kind: 'cross', size: 500, lineWidth: 50 })
  })
})

describe('a demo-like design in the editor', () => {
  let page: Page
  let lab: Awaited<ReturnType<typeof labWithDesign>>

  beforeAll(async () => {
    lab = await labWithDesign()
    page = await editorPage(browser, lab.as.designer, lab.lab.id, lab.designId)
  })
  afterAll(async () => {
    await page?.context().close()
  })

  it('opens, takes a new main-channel width in the inspector and saves it as revision 2', async () => {
    const p = await at(page, 5000, 3000)
    await page.mouse.click(p.x, p.y)
    await expect.poll(() => page.locator('[data-test="inspector-id"]').textContent()).toBe('tj-1')
    await page.fill('[data-test="field-mainWidth"]', '90')
    await page.press('[data-test="field-mainWidth"]', 'Enter')
    await expect.poll(() => page.locator('[data-test="dirty-state"]').textContent()).toBe('unsaved changes')
    await page.fill('[data-test="save-message"]', 'Main channel 90 µm')
    await page.click('[data-test="save"]')
    await expect.poll(() => page.locator('[data-test="dirty-state"]').textContent()).toBe('saved')
    expect(await page.locator('text=Editing from revision').textContent()).toContain('r2')
    const design = await lab.as.designer.get(`/api/labs/${lab.lab.id}/designs/${lab.designId}`)
    const latest = await lab.as.designer.get(`/api/labs/${lab.lab.id}/revisions/${design.json.design.latestRevisionId}`)
    expect(latest.json.number).toBe(2)
    expect(latest.json.document.components.find((c: any) => c.id === 'tj-1').mainWidth).toBe(90)
  })

  it('exports the document as JSON and, after another edit, imports the file back to the same document', async () => {
    const exported = await page.evaluate(() => JSON.parse(JSON.stringify((window as any).__dwEditor.store.doc)))
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-test="export-json"]')])
    expect(download.suggestedFilename()).toMatch(/\.chip\.json$/)
    const path = await download.path()
    const text = await readFile(path, 'utf8')
    expect(JSON.parse(text)).toEqual(exported)
    await page.click('[data-test="tool-place:y-junction"]')
    const q = await at(page, 8000, 1500)
    await page.mouse.click(q.x, q.y)
    await expect
      .poll(() => page.evaluate(() => (window as any).__dwEditor.store.doc.components.length))
      .toBe(exported.components.length + 1)
    await page.setInputFiles('[data-test="import-json"]', path)
    await expect
      .poll(() => page.evaluate(() => JSON.parse(JSON.stringify((window as any).__dwEditor.store.doc))))
      .toEqual(exported)
  })
})
