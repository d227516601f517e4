// Drawing junctions by mouse, as a designer would: a flow-focusing cross, a Y-junction and a step nozzle placed from the palette,
// fed by new ports through channels drawn point by point onto their terminals, each read back with its own
// forecast on the panel; to scale (the part's arms are the template's 300 µm on the saved document).
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { componentTerminals, type Component } from '../../shared/schemas/chip'
import { launch, shot } from '../support/browser'
import { labWithDesign } from '../support/designs'
import { at, editorDoc, editorPage } from '../support/editor'

let browser: Browser
let page: Page
beforeAll(async () => {
  browser = await launch()
  const lab = await labWithDesign()
  page = await editorPage(browser, lab.as.designer, lab.lab.id, lab.designId)
})
afterAll(async () => {
  await browser?.close()
})

const clickAt = async (x: number, y: number) => {
  const p = await at(page, x, y)
  await page.mouse.click(p.x, p.y)
}
const selected = () => page.locator('[data-test="inspector-id"]').textContent()
async function place(tool: string, x: number, y: number): Promise<string> {
  await page.click(`[data-test="tool-${tool}"]`)
  const before = (await editorDoc(page)).components.length + (await editorDoc(page)).ports.length
  await clickAt(x, y)
  await expect
    .poll(async () => {
      const d = await editorDoc(page)
      return d.components.length + d.ports.length
    })
    .toBe(before + 1)
  return (await selected())!
}
async function terminal(id: string, name: string) {
  const c = (await editorDoc(page)).components.find((x: Component) => x.id === id) as Component
  return componentTerminals(c).find(t => t.name === name)!.position
}
/** A channel through the given points (µm); the first and last are a port or a terminal, so it finishes itself. */
async function channel(points: Array<{ x: number; y: number }>) {
  await page.click('[data-test="tool-channel"]')
  const before = (await editorDoc(page)).channels.length
  for (const p of points) await clickAt(p.x, p.y)
  await expect.poll(async () => (await editorDoc(page)).channels.length).toBe(before + 1)
  return (await editorDoc(page)).channels.at(-1)
}
async function forecastOf(x: number, y: number) {
  await page.click('[data-test="tool-select"]')
  await clickAt(x, y)
  await expect
    .poll(() => page.locator('[data-test="forecast-dropletDiameter"] td').nth(1).textContent())
    .toMatch(/\d µm$/)
  return page.locator('[data-test="forecast-regime"] td').nth(1).textContent()
}

describe('drawing junctions by mouse', () => {
  it('a flow-focusing cross fed through three new ports gets its own forecast', async () => {
    const ff = await place('place:flow-focusing', 3000, 1600)
    expect(ff).toBe('ff-1')
    const d = await place('port:dispersed', 1200, 1600)
    const c = await place('port:continuous', 2000, 2300)
    const o = await place('port:outlet', 4800, 1600)
    const feed = await channel([{ x: 1200, y: 1600 }, await terminal(ff, 'dispersed')])
    expect(feed).toMatchObject({ start: { element: d, terminal: 'port' }, end: { element: ff, terminal: 'dispersed' } })
    await channel([{ x: 2000, y: 2300 }, { x: 3000, y: 2300 }, await terminal(ff, 'continuous-a')])
    await channel([
      { x: 2000, y: 2300 },
      { x: 2000, y: 1000 },
      { x: 3000, y: 1000 },
      await terminal(ff, 'continuous-b'),
    ])
    const out = await channel([await terminal(ff, 'outlet'), { x: 4800, y: 1600 }])
    expect(out).toMatchObject({ start: { element: ff, terminal: 'outlet' }, end: { element: o, terminal: 'port' } })
    expect(c).toBe('continuous-in-1')
    expect(await forecastOf(3000, 1600)).toMatch(/squeezing|transition|dripping|jetting/)
    expect(await selected()).toBe(ff)
    await shot(page, 'editor-draw-flow-focusing')
  })

  it('a Y-junction the same way; both new parts keep their forecasts and their arms stay at true length', async () => {
    const yj = await place('place:y-junction', 6500, 1600)
    const c = await place('port:continuous', 6000, 2400)
    const d = await place('port:dispersed', 6000, 800)
    const o = await place('port:outlet', 8500, 1600)
    await channel([{ x: 6000, y: 2400 }, await terminal(yj, 'continuous')])
    await channel([{ x: 6000, y: 800 }, await terminal(yj, 'dispersed')])
    await channel([await terminal(yj, 'outlet'), { x: 8500, y: 1600 }])
    expect([c, d, o].map(id => id.replace(/-\d+$/, ''))).toEqual(['continuous-in', 'dispersed-in', 'out'])
    expect(await forecastOf(6500, 1600)).toMatch(/squeezing|transition|dripping|jetting/)
    const doc = await editorDoc(page)
    expect(doc.components.find((x: Component) => x.id === yj).armLength).toBe(300)
    const out = await terminal(yj, 'outlet')
    expect(Math.hypot(out.x - 6500, out.y - 1600)).toBeCloseTo(300, 6)
    await expect.poll(() => page.locator('[data-test="forecast-error"]').count()).toBe(0)
    expect(await forecastOf(3000, 1600)).toMatch(/squeezing|transition|dripping|jetting/)
  })

  it('a step nozzle: its reservoir goes on a new deeper layer, and fed the same way it forecasts step emulsification', async () => {
    // On the right, clear of the layer list that sits over the top-left of the canvas.
    const step = await place('place:step-nozzle', 7200, 5200)
    const doc = await editorDoc(page)
    const part = doc.components.find((x: Component) => x.id === step)
    const reservoir = doc.layers.find((l: any) => l.id === part.reservoirLayerId)
    expect(reservoir.depth).toBeGreaterThanOrEqual(150)
    await place('port:dispersed', 7200, 4300)
    await place('port:continuous', 9300, 3700)
    await place('port:outlet', 9300, 6700)
    await channel([{ x: 7200, y: 4300 }, await terminal(step, 'dispersed')])
    await channel([{ x: 9300, y: 3700 }, await terminal(step, 'continuous')])
    await channel([await terminal(step, 'outlet'), { x: 9300, y: 6700 }])
    expect(await forecastOf(7350, 5200)).toMatch(/step-emulsification/)
    await shot(page, 'editor-draw-step-nozzle')
  })
})
