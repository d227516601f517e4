// The Libraries page in Chromium: an admin adds a lab liquid (a refused number says so beside its field, nothing
// typed is lost), the entry appears marked with its source; a designer reads it without edit buttons; the
// new-design form offers the starter chips and the lab's process.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
let admin: Page
let designer: Page
let labId: string

beforeAll(async () => {
  browser = await launch()
  const { lab, people } = await makeLab(['admin', 'designer'])
  labId = lab.id
  admin = await newPage(browser)
  await signInAs(admin, people[0]!.email, TEST_PASSWORD)
  await admin.waitForURL(/\/labs\//)
  designer = await newPage(browser)
  await signInAs(designer, people[1]!.email, TEST_PASSWORD)
  await designer.waitForURL(/\/labs\//)
})
afterAll(async () => { await browser?.close() })

describe('libraries page', () => {
  it('an admin adds a liquid; a refused value is named beside its field and kept', async () => {
    await admin.goto(`/labs/${labId}/libraries`)
    await hydrated(admin)
    await admin.click('[data-test="library-add-liquid"]')
    const form = admin.locator('[data-test="library-form-liquid"]')
    await form.locator('input[name="name"]').fill('Bench oil, lot 9')
    await form.locator('input[name="key"]').fill('bench-oil-9')
    await form.locator('input[name="table.0.viscosityMPaS"]').fill('-3')
    await form.locator('input[name="table.0.densityKgPerM3"]').fill('815')
    await admin.click('[data-test="library-save"]')
    await expect.poll(() => form.locator('[role="alert"]').first().textContent()).toContain('Viscosity must be above 0 mPa·s')
    expect(await form.locator('input[name="name"]').inputValue()).toBe('Bench oil, lot 9')
    await form.locator('input[name="table.0.viscosityMPaS"]').fill('3.4')
    await admin.click('[data-test="library-add-row"]')
    await form.locator('input[name="table.1.temperatureC"]').fill('37')
    await form.locator('input[name="table.1.viscosityMPaS"]').fill('2.5')
    await form.locator('input[name="table.1.densityKgPerM3"]').fill('803')
    await admin.click('[data-test="library-save"]')
    const row = admin.locator('[data-test="library-entry-lab-bench-oil-9"]')
    await row.waitFor()
    expect(await row.textContent()).toContain('measured in our lab')
    expect(await row.textContent()).toContain('20 °C: 3.4 mPa·s, 815 kg/m³')
    await shot(admin, 'libraries-admin')
  })

  it('a designer reads the library without edit buttons, and the new-design form offers the starters', async () => {
    await designer.goto(`/labs/${labId}/libraries`)
    await hydrated(designer)
    await designer.locator('[data-test="library-entry-lab-bench-oil-9"]').waitFor()
    expect(await designer.locator('[data-test="library-read-only"]').count()).toBe(1)
    expect(await designer.locator('[data-test="library-edit-lab-bench-oil-9"]').count()).toBe(0)
    await designer.goto(`/labs/${labId}/designs`)
    await hydrated(designer)
    await designer.click('[data-test="new-design"]')
    await designer.locator('[data-test="starter-step-emulsifier"]').check()
    await designer.fill('input[name="name"]', 'Step starter from the form')
    await shot(designer, 'libraries-new-design')
    await designer.click('[data-test="design-create-submit"]')
    await designer.waitForURL(/\/designs\/[0-9a-f-]{36}/)
  })
})
