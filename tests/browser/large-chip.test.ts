// A large chip (over LARGE_CHIP_PIECES drawn pieces) in Chromium: the revision page says its forecast is being
// computed and fills in by itself, and "Mask DXF" makes the mask in the background and then downloads it.
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { planParallelChip } from '../../geometry/arrays'
import { documentPieceCount, LARGE_CHIP_PIECES } from '../../shared/schemas/chip'
import { ApiClient } from '../support/api'
import { hydrated, launch, shot } from '../support/browser'
import { pageWithSession } from '../support/editor'
import { makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
})

describe('a large chip in the browser', () => {
  it('fills in its forecast by itself and downloads its mask from the background job', async () => {
    const { lab, people } = await makeLab(['designer'])
    const api = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
    const document = planParallelChip({ nozzles: 1280 }).document
    expect(documentPieceCount(document as never)).toBeGreaterThan(LARGE_CHIP_PIECES)
    const created = await api.post(`/api/labs/${lab.id}/designs`, { name: 'Large array 1280', document })
    expect(created.status).toBe(201)
    const page = await pageWithSession(browser, api, { width: 1280, height: 900 })
    page.setDefaultTimeout(60_000)
    await page.goto(`/labs/${lab.id}/revisions/${created.json.revisionId}`)
    await hydrated(page)
    // Straight after the save the summary job has not finished (a poll and about a second of geometry).
    expect(await page.locator('[data-test="summary-pending"]').count()).toBe(1)
    await shot(page, 'large-chip-pending')
    await page.locator('[data-test="summary-pending"]').waitFor({ state: 'detached' })
    await expect.poll(() => page.textContent('[data-test="revision-forecast"]')).toContain('1280 nozzles')
    expect(await page.locator('[data-test="dxf-link"]').count()).toBe(0) // the direct link is for small chips
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-test="dxf-export"]')])
    expect(download.suggestedFilename()).toMatch(/^large-array-1280_r1.*\.dxf$/)
    expect(await page.textContent('[data-test="dxf-export"]')).toContain('Mask DXF') // the button is back
    await shot(page, 'large-chip-ready')
    await page.context().close()
  }, 120_000)
})
