// Helpers for driving the chip editor in Chromium: world µm → screen, the working document, a signed-in page.
import type { Browser, Page } from 'playwright-core'
import { inject } from 'vitest'
import { hydrated } from './browser'
import type { ApiClient } from './api'

/** Screen point of a world point (µm) on the fixture chip, fitted into the canvas with a 24 px margin. */
export async function at(page: Page, x: number, y: number) {
  const b = (await page.locator('[data-test="editor-canvas"]').boundingBox())!
  const s = Math.min((b.width - 48) / 10000, (b.height - 48) / 7000)
  return { x: b.x + b.width / 2 + (x - 5000) * s, y: b.y + b.height / 2 - (y - 3500) * s }
}

/** The editor's working document, as plain JSON. */
export const editorDoc = (page: Page) => page.evaluate(() => JSON.parse(JSON.stringify((window as any).__dwEditor.store.doc)))

/** A 1280 × 800 page signed in with an API client's cookies, on the editor of a design. */
export async function editorPage(browser: Browser, as: ApiClient, labId: string, designId: string) {
  const context = await browser.newContext({ baseURL: inject('baseURL'), viewport: { width: 1280, height: 800 }, acceptDownloads: true })
  await context.addCookies([...as.cookies].map(([name, value]) => ({ name, value, url: inject('baseURL') })))
  const page = await context.newPage()
  page.setDefaultTimeout(15_000)
  await page.goto(`/labs/${labId}/designs/${designId}/edit`)
  await hydrated(page)
  await page.waitForSelector('[data-test="editor-canvas"] canvas')
  return page
}
