// The editor on a 512-nozzle array in Chromium: the chip is drawn (culled, simplified when tiny), a nozzle is picked
// and dragged at a close zoom, and the forecast after the edit carries the selected nozzle's junction — from the
// worker, which keeps the document and is sent only what the edit changed — and follows a new selection.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { generateParallelChip } from '../../geometry/arrays'
import { launch, shot } from '../support/browser'
import { editorPage } from '../support/editor'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
let page: Page
beforeAll(async () => {
  browser = await launch()
  const { lab, people } = await makeLab(['designer'])
  const api = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
  const created = await api.post(`/api/labs/${lab.id}/designs`, {
    name: 'Scale array 512',
    document: generateParallelChip({ nozzles: 512 }),
  })
  if (created.status !== 201) throw new Error(`create failed: ${created.status}`)
  page = await editorPage(browser, api, lab.id, created.json.designId)
  page.setDefaultTimeout(60_000)
  await page.waitForFunction(() => (window as any).__dwEditor?.live.value.summary)
}, 180_000)
afterAll(async () => {
  await browser?.close()
})

/** Share of the chip canvas's pixels painted by the chip layer (not the grey background). */
const ink = () =>
  page.evaluate(() => {
    const canvas = document.querySelector('[data-test="editor-canvas"] canvas') as HTMLCanvasElement
    const d = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height).data
    let n = 0
    for (let i = 0; i < d.length; i += 4) if (d[i + 3]! > 0) n++
    return n / (d.length / 4)
  })

/** Zooms to `scale` × the fit around component `index` and answers its id and screen point. */
const zoomTo = (index: number, factor: number) =>
  page.evaluate(
    ([index, factor]) => {
      const { store, canvas } = (window as any).__dwEditor
      const c = store.doc.components[index]
      canvas.value.fit()
      const v = canvas.value.view
      const r = document.querySelector('[data-test="editor-canvas"]')!.getBoundingClientRect()
      const s = v.scale * factor
      canvas.value.setView({ scale: s, tx: r.width / 2 - s * c.position.x, ty: r.height / 2 + s * c.position.y })
      // into the exposed nozzle, past the supply manifold it starts under
      return { id: c.id as string, x: r.left + r.width / 2 + s * (c.nozzleLength - 75), y: r.top + r.height / 2 }
    },
    [index, factor] as const,
  )

const focused = () =>
  page.evaluate(() =>
    ((window as any).__dwEditor.live.value.forecast?.junctions ?? []).map((j: { element: string }) => j.element),
  )

describe('editor on a 512-nozzle array', () => {
  it('draws the whole chip at the fit and a close-up when zoomed in', async () => {
    await page.evaluate(() => (window as any).__dwEditor.canvas.value.fit())
    await page.waitForTimeout(300)
    expect(await ink()).toBeGreaterThan(0.02)
    await zoomTo(300, 12)
    await page.waitForTimeout(300)
    expect(await ink()).toBeGreaterThan(0.02)
    await shot(page, 'editor-scale-zoomed')
  })

  it("picks a nozzle, drags it, and the forecast after the edit carries that nozzle's junction only", async () => {
    const t = await zoomTo(300, 12)
    await page.waitForTimeout(300)
    await page.mouse.click(t.x, t.y)
    await expect.poll(() => page.locator('[data-test="inspector-id"]').textContent()).toBe(t.id)
    const before = await page.evaluate(() => (window as any).__dwEditor.live.value.at)
    const x0 = await page.evaluate(
      id => (window as any).__dwEditor.store.doc.components.find((c: { id: string }) => c.id === id).position.x,
      t.id,
    )
    await page.mouse.move(t.x, t.y)
    await page.mouse.down()
    for (let k = 1; k <= 10; k++) await page.mouse.move(t.x + k * 6, t.y)
    await page.mouse.up()
    await page.waitForFunction(b => (window as any).__dwEditor.live.value.at > b, before)
    expect(
      await page.evaluate(
        id => (window as any).__dwEditor.store.doc.components.find((c: { id: string }) => c.id === id).position.x,
        t.id,
      ),
    ).toBeGreaterThan(x0)
    await expect.poll(focused).toEqual([t.id])
    await expect.poll(() => page.locator('[data-test="forecast-dropletDiameter"]').count()).toBe(1)
    // The canvas labels still cover every nozzle: they come from the summary.
    expect(await page.evaluate(() => (window as any).__dwEditor.live.value.summary.junctions.length)).toBe(512)
  })

  it("follows a new selection with that nozzle's junction", async () => {
    const t = await zoomTo(100, 12)
    await page.waitForTimeout(300)
    await page.mouse.click(t.x, t.y)
    await expect.poll(() => page.locator('[data-test="inspector-id"]').textContent()).toBe(t.id)
    await expect.poll(focused).toEqual([t.id])
    await expect.poll(() => page.locator('[data-test="forecast-dropletDiameter"]').count()).toBe(1)
  })
})
