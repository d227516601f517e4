// The revision viewer shows the whole chip, with a margin, on load and after Fit, at the widths people use
// (1440 and 1024 CSS px). A full page load hydrates the page, and Nuxt renders a `.client` component's template
// only after it mounts: the canvas once kept its default 800 × 600 px inside a smaller frame and cut the chip off.
// The layer panel floats over the frame's top-left corner: Fit keeps the chip clear of it (it hid the chip's corner).
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { hydrated, launch, signInAs } from '../support/browser'
import { designerWithDesign } from '../support/designs'
import { TEST_PASSWORD } from '../support/factory'

let browser: Browser
let setup: Awaited<ReturnType<typeof designerWithDesign>>
beforeAll(async () => {
  browser = await launch()
  setup = await designerWithDesign('Viewer fit T-junction')
})
afterAll(async () => {
  await browser?.close()
})

/** What the chip layer of the viewer paints within `band` CSS px of the frame's visible edges. */
async function edgeInk(page: Page, band = 6) {
  return page.evaluate(band => {
    const frame = document.querySelector('[data-test="viewer-canvas"]') as HTMLElement
    const canvas = frame.querySelector('canvas') as HTMLCanvasElement
    const ratio = canvas.width / parseFloat(canvas.style.width)
    const w = Math.min(frame.clientWidth, parseFloat(canvas.style.width))
    const h = Math.min(frame.clientHeight, parseFloat(canvas.style.height))
    const data = canvas.getContext('2d')!.getImageData(0, 0, Math.round(w * ratio), Math.round(h * ratio))
    const W = data.width,
      H = data.height,
      b = Math.round(band * ratio)
    let inked = 0,
      total = 0
    for (let y = 0; y < H; y++) {
      for (let x = 0; x < W; x++) {
        if (x >= b && x < W - b && y >= b && y < H - b) continue
        total++
        if (data.data[(y * W + x) * 4 + 3]! > 0) inked++
      }
    }
    let anyInk = 0
    for (let i = 3; i < data.data.length; i += 4) if (data.data[i]! > 0) anyInk++
    return {
      frame: [frame.clientWidth, frame.clientHeight],
      canvas: [parseFloat(canvas.style.width), parseFloat(canvas.style.height)],
      inked,
      total,
      anyInk,
    }
  }, band)
}

/** Chip pixels painted under the layer panel floating in the frame's top-left corner (hidden from the reader). */
async function inkUnderPanel(page: Page) {
  return page.evaluate(() => {
    const frame = document.querySelector('[data-test="viewer-canvas"]') as HTMLElement
    const panel = frame.querySelector('[data-test="layer-toggles"]')!.parentElement as HTMLElement
    const canvas = frame.querySelector('canvas') as HTMLCanvasElement
    const ratio = canvas.width / parseFloat(canvas.style.width)
    const w = Math.round((panel.offsetLeft + panel.offsetWidth) * ratio)
    const h = Math.round((panel.offsetTop + panel.offsetHeight) * ratio)
    const data = canvas.getContext('2d')!.getImageData(0, 0, w, h).data
    let inked = 0
    for (let i = 3; i < data.length; i += 4) if (data[i]! > 0) inked++
    return inked
  })
}

describe('revision viewer framing', () => {
  for (const width of [1440, 1024]) {
    it(`fits the whole chip at ${width} px wide, on load and after Fit`, async () => {
      const context = await browser.newContext({ baseURL: inject('baseURL'), viewport: { width, height: 900 } })
      const page = await context.newPage()
      await signInAs(page, setup.email, TEST_PASSWORD)
      await page.waitForURL(/\/labs\//)
      await page.goto(`/labs/${setup.labId}/revisions/${setup.revisionId}`)
      await hydrated(page)
      await page.waitForSelector('[data-test="viewer-canvas"] canvas')
      // The canvas takes the frame's size once the layout has settled.
      await expect
        .poll(
          async () => {
            const r = await edgeInk(page)
            return r.canvas.join('×')
          },
          { timeout: 5000 },
        )
        .toBe((await edgeInk(page)).frame.join('×'))
      const loaded = await edgeInk(page)
      expect(loaded.anyInk, 'the chip is drawn').toBeGreaterThan(1000)
      expect(loaded.inked, `chip pixels within 6 px of the frame edge (of ${loaded.total})`).toBe(0)
      expect(await inkUnderPanel(page), 'chip pixels hidden under the layer panel').toBe(0)

      await page.locator('[data-test="viewer-canvas"]').focus()
      await page.keyboard.press('+')
      await page.keyboard.press('+')
      await page.click('[data-test="zoom-fit"]')
      await page.waitForTimeout(200)
      const fitted = await edgeInk(page)
      expect(fitted.inked).toBe(0)
      expect(await inkUnderPanel(page)).toBe(0)
      expect(fitted.anyInk).toBeGreaterThan(1000)
      await context.close()
    })
  }
})
