// The new-design form in Chromium never drops input in silence: a file that is not a chip document blocks Create
// (it used to create a starter chip), and a name over 120 characters says so beside the field instead of being cut.
import { writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, signInAs } from '../support/browser'
import { designerWithDesign } from '../support/designs'
import { TEST_PASSWORD } from '../support/factory'

let browser: Browser
let page: Page
let setup: Awaited<ReturnType<typeof designerWithDesign>>
const designCount = async () => ((await setup.api.get(`/api/labs/${setup.labId}/designs`)).json as unknown[]).length
const submit = '[data-test="design-create-submit"]'

beforeAll(async () => {
  browser = await launch()
  setup = await designerWithDesign('Already here')
  page = await newPage(browser)
  await signInAs(page, setup.email, TEST_PASSWORD)
  await page.waitForURL(/\/labs\//)
  await page.goto(`/labs/${setup.labId}/designs`)
  await hydrated(page)
  await page.click('[data-test="new-design"]')
})
afterAll(async () => {
  await browser?.close()
})

describe('new design form', () => {
  it('a file that is not JSON blocks Create and creates nothing; clearing it unblocks', async () => {
    const before = await designCount()
    const bad = join(tmpdir(), `invalid-${Date.now()}.json`)
    writeFileSync(bad, '{ this is not json')
    await page.fill('[data-test="design-create"] input[name=name]', 'From a broken file')
    await page.setInputFiles('[data-test="design-upload"]', bad)
    await expect.poll(() => page.locator('[data-test="file-error"]').textContent()).toContain('is not JSON')
    expect(await page.isDisabled(submit)).toBe(true)
    await page.locator('[data-test="design-create"]').evaluate((f: HTMLFormElement) => f.requestSubmit())
    await page.waitForTimeout(300)
    expect(await designCount()).toBe(before)
    await page.click('[data-test="file-clear"]')
    expect(await page.isDisabled(submit)).toBe(false)
  })

  it('a name over 120 characters is kept whole with a message, and blocks Create', async () => {
    const long =
      'Parallel step emulsifier for single-cell encapsulation with a tapered supply manifold and two reservoir outlets, revised for the bench'
    expect(long.length).toBeGreaterThan(120)
    await page.fill('[data-test="design-create"] input[name=name]', long)
    expect(await page.inputValue('[data-test="design-create"] input[name=name]')).toBe(long)
    await expect.poll(() => page.locator('[data-test="name-error"]').textContent()).toContain('at most 120 characters')
    expect(await page.isDisabled(submit)).toBe(true)
    await page.fill('[data-test="design-create"] input[name=name]', 'Tapered manifold emulsifier')
    expect(await page.locator('[data-test="name-error"]').count()).toBe(0)
    const before = await designCount()
    await page.click(submit)
    await expect.poll(designCount).toBe(before + 1)
  })
})
