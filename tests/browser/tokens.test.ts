// API tokens on the account page in Chromium: made, shown once, listed, revoked; and the API reference page.
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
})

describe('API tokens in Chromium', () => {
  it('creates a token shown once, lists it, revokes it; the reference page lists the routes', async () => {
    const {
      people: [designer],
    } = await makeLab(['designer'])
    const page = await newPage(browser)
    await signInAs(page, designer!.email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.goto('/account')
    await hydrated(page)
    // Only roles within the person's are offered.
    const roles = await page.locator('#token-role option').allTextContents()
    expect(roles).toEqual(['Designer', 'Lab member'])
    await page.click('[data-test="token-create"]')
    await expect.poll(() => page.textContent('[data-test="token-form"]')).toContain('Give the token a name')
    await page.fill('#token-name', 'flow sweep')
    await page.click('[data-test="token-create"]')
    await page.waitForSelector('[data-test="token-created"]')
    expect(await page.inputValue('[data-test="token-value"]')).toMatch(/^dwt_[A-Za-z0-9_-]{43}$/)
    expect(await page.textContent('[data-test="token-flow sweep"]')).toContain('Lab member')
    await shot(page, 'account-tokens')
    await page.click('[data-test="token-revoke-flow sweep"]')
    await page.click('[data-test="token-revoke-confirm-flow sweep"]')
    await expect.poll(() => page.textContent('[data-test="token-flow sweep"]')).toContain('revoked')
    expect(await page.$('[data-test="token-created"]')).toBeNull()
    await page.reload()
    await hydrated(page)
    expect(await page.$('[data-test="token-created"]')).toBeNull() // never shown again

    await page.goto('/api-reference')
    await hydrated(page)
    await page.click('[data-test="op-POST /api/labs/{labId}/designs"] summary')
    expect(await page.textContent('[data-test="op-POST /api/labs/{labId}/designs"]')).toContain('designs:edit')
    await shot(page, 'api-reference')
  })
})
