// Helpers for driving the chip editor in Chromium: world µm → screen, the working document, a signed-in page.
import type { Browser, Page } from 'playwright-core'
import { inject } from 'vitest'
import { hydrated } from './browser'
import { worldOnPage } from './canvas'
import type { ApiClient } from './api'

/** Screen point of a world point (µm) on the editor's canvas, through the canvas's own view. */
export const at = (page: Page, x: number, y: number) => worldOnPage(page, '[data-test="editor-canvas"]', x, y)

/** The editor's working document, as plain JSON. */
export const editorDoc = (page: Page) =>
  page.evaluate(() => JSON.parse(JSON.stringify((window as any).__dwEditor.store.doc)))

/** A page of its own context, signed in with an API client's cookies (downloads accepted). */
export async function pageWithSession(browser: Browser, as: ApiClient, viewport = { width: 1280, height: 800 }) {
  const context = await browser.newContext({ baseURL: inject('baseURL'), viewport, acceptDownloads: true })
  await context.addCookies([...as.cookies].map(([name, value]) => ({ name, value, url: inject('baseURL') })))
  return context.newPage()
}

/** A 1280 × 800 page signed in with an API client's cookies, on the editor of a design. */
export async function editorPage(browser: Browser, as: ApiClient, labId: string, designId: string) {
  const page = await pageWithSession(browser, as)
  page.setDefaultTimeout(15_000)
  await page.goto(`/labs/${labId}/designs/${designId}/edit`)
  await hydrated(page)
  await page.waitForSelector('[data-test="editor-canvas"] canvas')
  return page
}
