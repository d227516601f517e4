import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launch, newPage, shot, signInAs, labOptionValue } from '../support/browser'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
})

describe('page guards and role menus in Chromium', () => {
  it('sends a signed-out visitor of a guarded page to sign-in, then back', async () => {
    const page = await newPage(browser)
    await page.goto('/labs/8f27fa87-b6bd-47d9-a2cc-3643ca281458/members')
    await page.waitForURL(/\/sign-in\?redirect=%2Flabs%2F|\/sign-in\?redirect=\/labs\//)
    expect(await page.isVisible('#email')).toBe(true)
    expect(await page.content()).not.toContain('members-table')
  })

  it('shows the admin the Members entry with role controls', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'admin@quillmere.example')
    await page.waitForURL(/\/labs\//)
    const quillmere = await labOptionValue(page, 'Quillmere')
    await page.selectOption('[data-test="lab-switcher"]', quillmere)
    await page.waitForURL(new RegExp(`/labs/${quillmere}$`))
    await page.click('[data-test="nav-members"]')
    await page.waitForSelector('[data-test="members-table"]')
    expect(await page.locator('[data-test="members-table"] select').count()).toBeGreaterThan(3)
    await shot(page, 'admin-members')
  })

  it('shows a designer the members without controls', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'designer@quillmere.example')
    await page.waitForURL(/\/labs\//)
    const quillmere = await labOptionValue(page, 'Quillmere')
    await page.goto(`/labs/${quillmere}/members`)
    await page.waitForSelector('[data-test="members-table"]')
    expect(await page.locator('[data-test="members-table"] select').count()).toBe(0)
    expect(await page.locator('[data-test="members-table"] button').count()).toBe(0)
  })

  it('shows the fabricator only what their role may do', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'fabricator@brackenfold.example')
    await page.waitForURL(/\/labs\//)
    const quillmere = await labOptionValue(page, 'Quillmere')
    // The lab's address lands a fabricator on the released revisions, their work; the menu offers only it and orders.
    await page.goto(`/labs/${quillmere}`)
    await page.waitForURL(new RegExp(`/labs/${quillmere}/releases$`))
    await page.waitForSelector('[data-test="nav-orders"]')
    expect(await page.locator('[data-test="nav-members"]').count()).toBe(0)
    expect(await page.locator('[data-test="nav-designs"]').count()).toBe(0)
    expect(await page.locator('[data-test="nav-releases"]').count()).toBe(1)
    await shot(page, 'fabricator-lab')
    // typing the address of a page the role may not open shows "not allowed", and the API says 403
    await page.goto(`/labs/${quillmere}/members`)
    await expect.poll(() => page.textContent('[data-test="error-page"]')).toContain('Not allowed')
  })

  it('answers a lab the person is not in with a not-found page', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'designer@quillmere.example')
    await page.waitForURL(/\/labs\//)
    await page.goto('/labs/00000000-0000-4000-8000-000000000000')
    await page.waitForSelector('[data-test="error-page"]')
    expect(await page.textContent('[data-test="error-page"]')).toContain('Not found')
    expect(new URL(page.url()).pathname).toBe('/labs/00000000-0000-4000-8000-000000000000')
  })
})
