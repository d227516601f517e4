// A lab member records a bench run on a released chip the fab has reported as built, in Chromium: the form offers
// the as-built chip first and says what was reported, a measured size or a bench temperature typed wrong is refused
// beside its field with nothing recorded, and the recorded run says which chip its forecast ran on.
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, memberEmails, shot, signedInPage } from '../support/browser'
import { labWithDesign } from '../support/designs'
import { TEST_PASSWORD } from '../support/factory'
import { releasedOrder } from '../support/orders'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
})

describe('bench runs on the as-built chip, in the browser', () => {
  it('offers the reported chip, refuses a bad measured size in place, and labels the run', async () => {
    const c = await labWithDesign()
    const { revisionId } = await releasedOrder(c)
    const reported = await c.as.fabricator.post(`/api/labs/${c.lab.id}/revisions/${revisionId}/as-built`, {
      depths: [{ layerId: 'ch50', depthUm: 42 }],
    })
    expect(reported.status).toBe(201)
    const emails = await memberEmails(c.as.admin, c.lab.id)
    const page = await signedInPage(browser, emails.experimenter!, TEST_PASSWORD)
    await page.goto(`/labs/${c.lab.id}/revisions/${revisionId}/bench`)
    await hydrated(page)

    const choice = page.locator('[data-test="bench-chip"]')
    expect(await page.isChecked('[data-test="bench-chip-as-built"]')).toBe(true)
    expect(await choice.textContent()).toMatch(/As built \(reported .+ by .+: .+ 42 µm deep\)/)

    await page.fill('[data-test="bench-values"]', '47.5 48.1 48.9')
    await page.fill('[data-test="bench-size-depth"]', '-4')
    await page.click('[data-test="bench-submit"]')
    await expect.poll(() => choice.textContent()).toContain('As-built depth must be > 0 µm')
    expect(await page.locator('[data-test="bench-run-1"]').count()).toBe(0)
    expect(await page.inputValue('[data-test="bench-values"]')).toBe('47.5 48.1 48.9')

    await page.fill('[data-test="bench-size-depth"]', '')
    // A bench temperature out of range is refused beside its field, nothing recorded.
    await page.fill('[data-test="bench-temperature"]', '200')
    await page.click('[data-test="bench-submit"]')
    await expect
      .poll(() => page.locator('[data-test="bench-temperature"] + [role="alert"]').textContent())
      .toBe('Temperature must be between −20 °C and 150 °C')
    expect(await page.locator('[data-test="bench-run-1"]').count()).toBe(0)
    await page.fill('[data-test="bench-temperature"]', '')
    await page.click('[data-test="bench-submit"]')
    await page.locator('[data-test="bench-run-1"]').waitFor()
    expect(await page.textContent('[data-test="bench-run-1"] [data-test="bench-chip-of-run"]')).toBe('Chip as built')
    // The design's forecast table names the junction as the drawing does, not by its id alone.
    expect(await page.textContent('[data-test="calibration-junction"]')).toBe('T-junction “tj-1”')
    await shot(page, 'bench-as-built')
  }, 90_000)
})
