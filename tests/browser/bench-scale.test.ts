// The micrograph's scale from its scale bar, picked on the image in Chromium: two clicks at known image pixels give
// the bar's length in pixels, its length in µm gives µm per pixel, and the measured drops come back at that scale.
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

describe('scale bar picked on the micrograph', () => {
  it('turns two clicks on the image into the bar length in pixels and measures at that scale', async () => {
    const { lab, people } = await makeLab(['designer', 'experimenter'])
    const designer = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
    const made = await designer.post(`/api/labs/${lab.id}/designs`, {
      name: 'Scale bar chip',
      document: fixtureDocument(),
    })
    expect(made.status).toBe(201)
    const size = 480
    const { png } = await dropsPng(12, 44, size, 9)
    const image = join(tmpdir(), `dw-scale-${Date.now()}.png`)
    writeFileSync(image, png)

    const page = await newPage(browser)
    await signInAs(page, people[1]!.email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.goto(`/labs/${lab.id}/revisions/${made.json.revisionId}/bench`)
    await hydrated(page)
    await page.click('[data-test="bench-mode-micrograph"]')
    await page.setInputFiles('[data-test="bench-image"]', image)
    await page.click('[data-test="bench-scale-bar"]')
    const target = page.locator('[data-test="scale-bar-image"]')
    await target.waitFor()
    await target.scrollIntoViewIfNeeded()
    const box = (await target.boundingBox())!
    // The image is shown scaled to the form's width: click where image pixels (40, 450) and (440, 450) are shown.
    const at = (x: number, y: number) => ({ x: box.x + (x / size) * box.width, y: box.y + (y / size) * box.height })
    const a = at(40, 450)
    const b = at(440, 450)
    await page.mouse.click(a.x, a.y)
    await page.mouse.click(b.x, b.y)
    await expect.poll(async () => Number(await page.inputValue('[data-test="bench-bar-px"]'))).toBeGreaterThan(398)
    const picked = Number(await page.inputValue('[data-test="bench-bar-px"]'))
    // One screen pixel of the scaled image is size / box.width image pixels: the pick is within that of 400 px.
    expect(Math.abs(picked - 400)).toBeLessThanOrEqual(size / box.width + 0.1)
    await page.fill('[data-test="bench-bar-um"]', (picked * 1.1).toFixed(2))
    expect(await page.textContent('[data-test="bench-bar-scale"]')).toContain('1.1 µm/px')
    await shot(page, 'bench-scale-bar')
    await page.click('[data-test="bench-submit"]')
    await page.locator('[data-test="bench-micrograph"]').waitFor({ timeout: 30_000 })
    expect(await page.textContent('[data-test="bench-micrograph"]')).toContain('at 1.1 µm/px')
    expect(await page.textContent('[data-test="micrograph-stats"]')).toContain('n = 12')
  })
})
