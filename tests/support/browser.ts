// Debian's chromium driven by playwright-core (never a downloaded browser).
import { chromium, type Browser, type Page } from 'playwright-core'
import { inject } from 'vitest'
import { DEMO_PASSWORD } from '../../server/db/demo'

export async function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
    // playwright gives every launch a fresh, empty profile folder of its own.
  })
}

export async function newPage(browser: Browser): Promise<Page> {
  const context = await browser.newContext({ baseURL: inject('baseURL'), viewport: { width: 1280, height: 800 } })
  return context.newPage()
}

export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in')
  await hydrated(page)
  await page.fill('#email', email)
  await page.fill('#password', password)
  await page.click('button[type=submit]')
}

/** A new page signed in as `email`, on its lab's landing page, hydrated. */
export async function signedInPage(browser: Browser, email: string, password = DEMO_PASSWORD): Promise<Page> {
  const page = await newPage(browser)
  await signInAs(page, email, password)
  await page.waitForURL(/\/labs\//)
  await hydrated(page)
  return page
}

/** Role → e-mail of a lab's members, as its admin sees them (tests whose lab has one person per role). */
export async function memberEmails(
  admin: { get: (path: string) => Promise<{ json: unknown }> },
  labId: string,
): Promise<Record<string, string>> {
  const members = (await admin.get(`/api/labs/${labId}/members`)).json as { role: string; email: string }[]
  return Object.fromEntries(members.map(m => [m.role, m.email]))
}

export const shot = (page: Page, name: string) => page.screenshot({ path: `test-results/${name}.png`, fullPage: true })

/** Resolves once Nuxt has hydrated the page, so a click reaches Vue and not the browser's own form submission. */
export async function hydrated(page: Page) {
  await page.waitForFunction(() => {
    const app = (
      document.querySelector('#__nuxt') as
        (Element & { __vue_app__?: { config: { globalProperties: { $nuxt?: { isHydrating?: boolean } } } } }) | null
    )?.__vue_app__
    return app?.config.globalProperties.$nuxt?.isHydrating === false
  })
}

/** The lab switcher's value for the lab whose name contains `name`, once the switcher lists it. */
export async function labOptionValue(page: Page, name: string): Promise<string> {
  const option = page.locator('[data-test="lab-switcher"] option', { hasText: name }).first()
  await option.waitFor({ state: 'attached' })
  return (await option.getAttribute('value'))!
}
