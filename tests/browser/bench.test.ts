// The bench loop as a lab member lives it, in Chromium: open a revision's bench results, import a CSV (a bad row is
// named and nothing imported, then fixed), upload a micrograph and watch it measured, exclude a false detection,
// see measured against forecast and the lab's fitted α with its interval, switch the design to the calibrated
// forecast and back.
import { writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient } from '../support/api'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'
import { dropsPng } from '../support/micrograph'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
})

describe('bench results in the browser', () => {
  it('records a CSV run and a micrograph run, excludes a detection, and switches the forecast', async () => {
    const { lab, people } = await makeLab(['designer', 'experimenter'])
    const designer = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
    const made = await designer.post(`/api/labs/${lab.id}/designs`, {
      name: 'Bench story chip',
      document: fixtureDocument(),
    })
    expect(made.status).toBe(201)
    const { png } = await dropsPng(12, 44, 480, 9)
    const image = join(tmpdir(), `dw-bench-${Date.now()}.png`)
    writeFileSync(image, png)

    const page = await newPage(browser)
    await signInAs(page, people[1]!.email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.goto(`/labs/${lab.id}/revisions/${made.json.revisionId}`)
    await hydrated(page)
    await page.click('[data-test="bench-link"]')
    await page.waitForURL(/\/bench$/)
    await hydrated(page)

    // CSV with a bad row: named before sending, nothing imported.
    await page.click('[data-test="bench-mode-csv"]')
    await page.fill('[data-test="bench-csv-text"]', 'drop,diameter\n1,50.1\n2,abc\n3,49.8')
    await expect
      .poll(() => page.textContent('[data-test="bench-csv-errors"]'))
      .toContain('Row 3: "abc" is not a number')
    await page.click('[data-test="bench-submit"]')
    expect(await page.locator('[data-test^="bench-run-"]').count()).toBe(0)
    await page.fill('[data-test="bench-csv-text"]', 'drop,diameter\n1,50.1\n2,50.6\n3,49.8')
    await expect.poll(() => page.textContent('[data-test="bench-csv-ok"]')).toContain('3 sizes ready')
    await page.click('[data-test="bench-submit"]')
    await page.locator('[data-test="bench-run-1"]').waitFor()

    // Micrograph: upload, measured, overlay shown.
    await page.click('[data-test="bench-mode-micrograph"]')
    await page.setInputFiles('[data-test="bench-image"]', image)
    await page.fill('[data-test="bench-scale"]', '1.1')
    await page.click('[data-test="bench-submit"]')
    await page.locator('[data-test="bench-micrograph"]').waitFor({ timeout: 30_000 })
    await page.locator('[data-test="bench-run-2"]').waitFor()
    expect(await page.textContent('[data-test="micrograph-stats"]')).toContain('n = 12')

    // Exclude one detection with the keyboard and save.
    const drop = page.locator('circle[role="button"]').first()
    await drop.focus()
    await page.keyboard.press('Enter')
    expect(await page.textContent('[data-test="micrograph-stats"]')).toContain('n = 11')
    await page.click('[data-test="save-exclusions"]')
    await expect
      .poll(() => page.textContent('[data-test="bench-run-2"]'))
      .toMatch(/Micrograph\s*Chip as drawn\s*the design's operating point\s*11/)
    await shot(page, 'bench-micrograph')

    // Measured against forecast, the fitted α with its interval, and the switch.
    expect(await page.locator('[data-test="bench-plot"] circle').count()).toBe(2)
    // The fixture chip forecasts dripping: a correction factor k, fitted apart from squeezing's α.
    await expect
      .poll(() => page.textContent('[data-test="calibration-t-junction/dripping"]'))
      .toMatch(/dripping regime: k .*95 % interval .* – /)
    await page.click('[data-test="mode-calibrated"]')
    await expect.poll(() => page.getAttribute('[data-test="mode-calibrated"]', 'aria-checked')).toBe('true')
    expect(await page.textContent('[data-test="calibrated-label"]')).toMatch(/Lab-calibrated: k .* from 2 runs/)
    await page.click('[data-test="mode-model"]')
    await expect.poll(() => page.getAttribute('[data-test="mode-model"]', 'aria-checked')).toBe('true')
    await shot(page, 'bench-page')
  })
})
