// The planner as a designer uses it, in Chromium: 40 µm drops at ≥ 500 Hz from the demo T-junction's liquids —
// window, recommended point, "Use this point", the forecast matching; the cell loading for 2 million cells/mL; and
// "Plan a new generator" from the design list: a 25 µm step emulsifier whose array opens in the editor.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoDesigns } from '../../server/db/demo-designs'
import { hydrated, shot } from '../support/browser'
import { at, editorDoc, editorPage } from '../support/editor'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
let api: ApiClient
let labId = ''
let designId = ''
const demoTJunction = demoDesigns()[0]!.revisions.at(-1)!.document

beforeAll(async () => {
  const { launch } = await import('../support/browser')
  browser = await launch()
  const { lab, people } = await makeLab(['designer'])
  labId = lab.id
  api = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
  const created = await api.post(`/api/labs/${lab.id}/designs`, {
    name: 'Planner story T-junction',
    document: demoTJunction,
  })
  if (created.status !== 201) throw new Error(`create failed: ${created.status} ${JSON.stringify(created.json)}`)
  designId = created.json.designId
})
afterAll(async () => {
  await browser?.close()
})

const umOf = (text: string | null) => Number.parseFloat((text ?? '').replace(/[^\d.]/g, ''))

describe('planner in Chromium', () => {
  let page: Page
  const problems: string[] = []

  it('plans 40 µm at ≥ 500 Hz for the selected junction, applies the point as one undoable edit, and the forecast matches', async () => {
    page = await editorPage(browser, api, labId, designId)
    page.on('console', m => {
      if (m.type() === 'error') problems.push(m.text())
    })
    page.on('pageerror', e => problems.push(e.message))
    const p = await at(page, 5000, 3000)
    await page.mouse.click(p.x, p.y)
    await page.waitForSelector('[data-test="planner-target"]')
    await page.fill('[data-test="planner-diameter"]', '40')
    await page.fill('[data-test="planner-rate"]', '500')
    await page.fill('[data-test="planner-cells"]', '2')
    await page.click('[data-test="planner-run"]')
    // The scan runs in a Web Worker: the page answers at once while it runs.
    const asked = Date.now()
    await page.evaluate(() => document.title)
    expect(Date.now() - asked).toBeLessThan(1000)
    await page.waitForSelector('[data-test="planner-recommended"]', { timeout: 30_000 })
    await page.waitForSelector('[data-test="planner-map"] svg path', { state: 'attached' })
    const planned = umOf(await page.locator('[data-test="planner-recommended-diameter"]').textContent())
    expect(Math.abs(planned - 40)).toBeLessThanOrEqual(2)
    expect(
      Number.parseFloat((await page.locator('[data-test="planner-recommended-rate"]').textContent())!),
    ).toBeGreaterThan(0)
    expect(await page.locator('[data-test="planner-reason"]').textContent()).toMatch(/scanned point/)
    // 2e6 cells/mL in ≈ 33.5 pL drops: λ ≈ 0.067 (Poisson loading, Collins et al. 2015)
    expect(Number.parseFloat((await page.locator('[data-test="planner-lambda"]').textContent())!)).toBeCloseTo(0.067, 2)
    await page.locator('[data-test="planner-map"]').scrollIntoViewIfNeeded()
    await shot(page, 'planner-window')
    await page.locator('[data-test="planner-loading"]').scrollIntoViewIfNeeded()
    await page.locator('[data-test="planner-loading"]').screenshot({ path: 'test-results/planner-loading.png' })
    await page.locator('[data-test="planner-recommended"]').screenshot({ path: 'test-results/planner-recommended.png' })

    const before = await editorDoc(page)
    await page.click('[data-test="planner-apply"]')
    await expect
      .poll(async () => JSON.stringify((await editorDoc(page)).operatingPoints[0].inlets))
      .not.toBe(JSON.stringify(before.operatingPoints[0].inlets))
    expect(await page.getAttribute('[data-test="cmd-undo"]', 'title')).toBe('Undo set inlets (Ctrl Z)')
    // The live forecast of the applied point gives the planned size.
    await expect
      .poll(async () => umOf(await page.locator('[data-test="forecast-dropletDiameter"] td').nth(1).textContent()), {
        timeout: 15_000,
      })
      .toBeCloseTo(planned, 0)
    await page.click('[data-test="cmd-undo"]')
    await expect
      .poll(async () => JSON.stringify((await editorDoc(page)).operatingPoints[0].inlets))
      .toBe(JSON.stringify(before.operatingPoints[0].inlets))
  })

  it('plans a new 25 µm step emulsifier from the design list and opens its nozzle array in the editor', async () => {
    await page.goto(`/labs/${labId}/designs`)
    await hydrated(page)
    await page.click('[data-test="plan-generator"]')
    await page.waitForSelector('[data-test="planner-new"]')
    await hydrated(page)
    await page.fill('[data-test="planner-diameter"]', '25')
    await page.fill('[data-test="planner-rate"]', '5000')
    await page.click('[data-test="planner-run"]')
    await page.waitForSelector('[data-test="planner-geometry-step"]', { timeout: 30_000 })
    expect(await page.locator('[data-test="planner-depth-step"]').textContent()).toBe('6.25 µm')
    await shot(page, 'planner-new-generator')
    await page.click('[data-test="planner-create-step"]')
    await page.waitForURL(/\/designs\/[^/]+\/edit$/)
    await page.waitForSelector('[data-test="editor-canvas"] canvas')
    const doc = await editorDoc(page)
    expect(doc.layers.some((l: { depth: number }) => l.depth === 6.25)).toBe(true)
    expect(doc.components.filter((c: { kind: string }) => c.kind === 'step-nozzle').length).toBeGreaterThan(1)
    await expect
      .poll(() => page.locator('[data-test="findings-count"]').textContent(), { timeout: 15_000 })
      .toMatch(/^0 errors/)
    await shot(page, 'planner-new-design')
    expect(problems).toEqual([])
  })
})
