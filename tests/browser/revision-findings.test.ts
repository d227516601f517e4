// The revision page lists the design-rule findings where reviewers decide (it used to show only counts), each a
// click away on the drawing, and counts read as words ("1 warning", not "1 warnings").
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, signInAs } from '../support/browser'
import { ApiClient } from '../support/api'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
let page: Page
let url = ''
beforeAll(async () => {
  browser = await launch()
  const { lab, people } = await makeLab(['designer', 'reviewer'])
  const designer = await new ApiClient().signIn(people.find(p => p.role === 'designer')!.email, TEST_PASSWORD)
  const doc = fixtureDocument()
  doc.channels[1].width = 100 // onto the T-junction's 50 µm dispersed arm: one width-step warning
  const created = await designer.post(`/api/labs/${lab.id}/designs`, {
    name: 'Findings on the revision page',
    document: doc,
  })
  expect(created.status).toBe(201)
  url = `/labs/${lab.id}/revisions/${created.json.revisionId}`
  page = await newPage(browser)
  await signInAs(page, people.find(p => p.role === 'reviewer')!.email, TEST_PASSWORD)
  await page.waitForURL(/\/labs\//)
})
afterAll(async () => {
  await browser?.close()
})

describe('findings on the revision page', () => {
  it('the reviewer sees each finding in words and can go to it on the drawing', async () => {
    await page.goto(url)
    await hydrated(page)
    const panel = page.locator('[data-test="findings-panel"]')
    await expect
      .poll(() => panel.textContent())
      .toContain('is 100 µm wide where it joins terminal "dispersed" of "tj-1"')
    expect(await page.locator('[data-test="findings-count"]').textContent()).toMatch(/^0 errors, 2 warnings, 1 note$/)
    expect(await page.locator('aside').textContent()).not.toMatch(/\b1 (errors|warnings|notes)\b/)
    await page.waitForSelector('[data-test="viewer-canvas"] canvas')
    await page.locator('[data-test="finding-terminal-width-step"]').click()
    // The drawing centres on the finding: the viewer's readout of the point under the centre of the canvas is there.
    const box = (await page.locator('[data-test="viewer-canvas"]').boundingBox())!
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2)
    const spans = await page.locator('[data-test="cursor-readout"] > span').allTextContents()
    const [x, y] = spans.map(t => Number(t.replace(/^\s*[xy]/, '').replace(/[^\d.-]/g, '')))
    expect(Math.abs(x! - 5000)).toBeLessThan(60)
    expect(Math.abs(y! - 3200)).toBeLessThan(60)
  })
})
