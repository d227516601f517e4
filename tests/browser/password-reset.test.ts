import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient } from '../support/api'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { resetLink, waitForMail } from '../support/mail'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
})

describe('forgotten password in Chromium', () => {
  it('asks for a link from the sign-in page, sets a new password from the mail, and is signed in; other sessions end', async () => {
    const {
      lab,
      people: [person],
    } = await makeLab(['designer'])
    const elsewhere = await new ApiClient().signIn(person!.email, TEST_PASSWORD)

    const page = await newPage(browser)
    await page.goto('/sign-in')
    await hydrated(page)
    await page.click('[data-test="forgot-password"]')
    await page.waitForURL(/\/forgot-password$/)
    await hydrated(page)
    await page.fill('#forgot-email', person!.email)
    await page.click('[data-test="forgot-submit"]')
    await expect
      .poll(() => page.textContent('[data-test="forgot-sent"]').catch(() => null))
      .toMatch(/If a Dropwright account uses that address/)
    await shot(page, 'forgot-password')

    const { path } = resetLink(await waitForMail(person!.email))
    await page.goto(path)
    await hydrated(page)
    expect(await page.inputValue('#reset-email')).toBe(person!.email)
    // The browser checks what it can (the address as the password)…
    await page.fill('#reset-password', person!.email.split('@')[0]!)
    await page.click('[data-test="reset-submit"]')
    await expect
      .poll(() => page.textContent('[data-test="reset-password-error"]').catch(() => null))
      .toMatch(/your e-mail address or your name/)
    // …and shows the server's message for a password on the common list.
    await page.fill('#reset-password', 'password123')
    await page.click('[data-test="reset-submit"]')
    await expect
      .poll(() => page.textContent('[data-test="reset-password-error"]').catch(() => null))
      .toMatch(/common and leaked passwords/)
    await shot(page, 'reset-password')
    await page.fill('#reset-password', 'heron-basalt-capillary')
    await page.click('[data-test="reset-submit"]')
    await page.waitForURL(new RegExp(`/labs/${lab.id}$`))
    await expect.poll(() => page.textContent('[data-test="signed-in-as"]').catch(() => null)).toBe(person!.name)

    expect((await elsewhere.get('/api/auth/session')).status).toBe(401)
    await new ApiClient().signIn(person!.email, 'heron-basalt-capillary')

    const late = await newPage(browser)
    await late.goto(path)
    await expect
      .poll(() => late.textContent('[data-test="reset-invalid"]').catch(() => null))
      .toMatch(/already been used/)
  })

  it('changes the password on the account page, then signs out everywhere', async () => {
    const {
      people: [person],
    } = await makeLab(['designer'])
    const elsewhere = await new ApiClient().signIn(person!.email, TEST_PASSWORD)
    const page = await newPage(browser)
    await signInAs(page, person!.email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.click('[data-test="signed-in-as"]')
    await page.waitForURL(/\/account$/)
    await hydrated(page)
    await page.fill('#current-password', TEST_PASSWORD)
    await page.fill('#new-password', 'qwertyuiop')
    await page.click('[data-test="password-submit"]')
    await expect.poll(() => page.textContent('[data-test="password-form"]')).toMatch(/common and leaked passwords/)
    await page.fill('#new-password', 'lichen-sextant-marrow')
    await page.click('[data-test="password-submit"]')
    await expect
      .poll(() => page.textContent('[data-test="password-changed"]').catch(() => null))
      .toBe('Password changed. 1 other session was signed out.')
    await shot(page, 'account')
    expect((await elsewhere.get('/api/auth/session')).status).toBe(401)

    await page.click('[data-test="sign-out-everywhere-ask"]')
    await page.click('[data-test="sign-out-everywhere-confirm"]')
    await page.waitForURL(/\/sign-in/)
    await hydrated(page)
    await page.goto('/account')
    await page.waitForURL(/\/sign-in/)
  })
})
