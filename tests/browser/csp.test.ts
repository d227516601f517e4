// The Content-Security-Policy is on and the app lives with it: Chromium loads the sign-in page, the designs list and
// the editor (Konva canvas, ECharts plots, the forecast Web Worker, local fonts) with no CSP violation and no error
// in the console, while an injected inline script is blocked.
import type { Browser, ConsoleMessage, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, signInAs } from '../support/browser'
import { designerWithDesign } from '../support/designs'
import { at } from '../support/editor'
import { TEST_PASSWORD } from '../support/factory'

let browser: Browser
let email = ''
let labId = ''
let designId = ''
beforeAll(async () => {
  browser = await launch()
  const made = await designerWithDesign('CSP check chip')
  email = made.email
  labId = made.labId
  designId = made.designId
})
afterAll(async () => {
  await browser?.close()
})

interface Watch {
  violations: string[]
  errors: string[]
}

/** Collects CSP violations (the DOM event, in every document of the page) and console errors. */
async function watch(page: Page): Promise<Watch> {
  const seen: Watch = { violations: [], errors: [] }
  await page.exposeFunction('__dwViolation', (text: string) => {
    seen.violations.push(text)
  })
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', e => {
      ;(window as unknown as { __dwViolation: (t: string) => void }).__dwViolation(
        `${e.violatedDirective} blocked ${e.blockedURI || 'inline'} at ${e.sourceFile}:${e.lineNumber}`,
      )
    })
  })
  page.on('console', (m: ConsoleMessage) => {
    if (m.type() === 'error') seen.errors.push(m.text())
  })
  page.on('pageerror', e => {
    seen.errors.push(String(e))
  })
  return seen
}

describe('Content-Security-Policy in Chromium', () => {
  it('sign-in, designs list and editor load with no CSP violation or console error', async () => {
    const page = await newPage(browser)
    const seen = await watch(page)

    const signIn = await page.goto('/sign-in')
    expect(signIn!.headers()['content-security-policy']).toMatch(/script-src [^;]*'nonce-/)
    await hydrated(page)
    // The policy is really enforced: an inline script added to the page and an inline handler do not run, and each
    // is reported. (No 'unsafe-eval' either: tests/api/headers.test.ts reads the policy itself.)
    const ran = await page.evaluate(() => {
      const w = window as unknown as Record<string, unknown>
      const s = document.createElement('script')
      s.textContent = 'window.__dwInjected = true'
      document.body.append(s)
      const b = document.createElement('button')
      b.setAttribute('onclick', 'window.__dwClicked = true')
      document.body.append(b)
      b.click()
      return { inline: w.__dwInjected === true, handler: w.__dwClicked === true }
    })
    expect(ran).toEqual({ inline: false, handler: false })
    await expect.poll(() => seen.violations.length).toBe(2)
    expect(seen.violations.join('\n')).toMatch(/script-src-elem|script-src/)
    expect(seen.violations.join('\n')).toMatch(/script-src-attr/)
    seen.violations.length = 0
    seen.errors.length = 0 // the console reports the blocked script too

    await signInAs(page, email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.goto(`/labs/${labId}/designs`)
    await hydrated(page)
    await page.getByText('CSP check chip').first().waitFor()

    await page.goto(`/labs/${labId}/designs/${designId}/edit`)
    await hydrated(page)
    await page.waitForSelector('[data-test="editor-canvas"] canvas')
    // Select the junction: the forecast worker answers and ECharts draws its SVG plots.
    const p = await at(page, 5000, 3000)
    await page.mouse.click(p.x, p.y)
    await expect.poll(() => page.locator('[data-test="inspector-id"]').textContent()).toBe('tj-1')
    await expect
      .poll(() => page.locator('[data-test="forecast-dropletDiameter"] td').nth(1).textContent())
      .toMatch(/µm$/)
    await page.waitForSelector('[data-test="plot-ratio"] svg path', { state: 'attached' })
    await page.waitForTimeout(300)
    // Fonts are the app's own files and loaded.
    expect(await page.evaluate(() => document.fonts.check('16px "IBM Plex Sans"'))).toBe(true)

    expect(seen.violations).toEqual([])
    expect(seen.errors).toEqual([])
  })
})
