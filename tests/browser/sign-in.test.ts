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

describe('sign-in in Chromium', () => {
  it('signs the demo designer in and lands in their lab', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'designer@quillmere.example')
    await page.waitForURL(/\/labs\/[0-9a-f-]{36}$/)
    await expect.poll(() => page.textContent('[data-test="lab-name"]')).toMatch(/Lab|Group/)
    expect(await page.textContent('[data-test="signed-in-as"]')).toBe('Tomas Reyvik')
    expect(await page.textContent('[data-test="lab-role"]')).toMatch(/Designer|Reviewer/)
    // The credential cookie is invisible to page scripts.
    expect(await page.evaluate(() => document.cookie)).not.toContain('dw_session')
    await shot(page, 'designer-lab')
  })

  it('shows one generic message for a wrong password and keeps the e-mail typed', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'designer@quillmere.example', 'wrong-password')
    await expect.poll(() => page.textContent('[data-test="sign-in-error"]')).toBe('Wrong e-mail or password')
    expect(await page.inputValue('#email')).toBe('designer@quillmere.example')
    expect(new URL(page.url()).pathname).toBe('/sign-in')
  })

  it('switches labs with the lab switcher, with the role of that lab', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'designer@quillmere.example')
    await page.waitForURL(/\/labs\//)
    const orrin = await labOptionValue(page, 'Orrin Valley')
    await page.selectOption('[data-test="lab-switcher"]', orrin)
    await page.waitForURL(new RegExp(`/labs/${orrin}$`))
    await expect.poll(() => page.textContent('[data-test="lab-role"]')).toBe('Reviewer')
  })

  it('signs out and the guarded pages send the visitor back to sign-in', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'experimenter@quillmere.example')
    await page.waitForURL(/\/labs\//)
    const labUrl = page.url()
    await page.click('[data-test="sign-out"]')
    await page.waitForURL(/\/sign-in/)
    await page.goto(labUrl)
    await page.waitForURL(/\/sign-in\?redirect=/)
  })
})
