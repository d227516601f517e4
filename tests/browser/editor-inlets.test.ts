// Driving an inlet by pressure in the editor, in Chromium: switching from flow to pressure starts from the pressure
// the chip needs now (the flow stays what it was), every inlet shows its pressure and its flow, a refused number
// stays typed with its message and changes nothing, and a pressure above the bond limit is marked.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launch, shot } from '../support/browser'
import { labWithDesign } from '../support/designs'
import { editorDoc, editorPage } from '../support/editor'

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

const cell = (what: 'pressure' | 'flow', port: string) => page.locator(`[data-test="inlet-${what}-${port}"]`)
const number = async (what: 'pressure' | 'flow', port: string) =>
  Number.parseFloat((await cell(what, port).textContent()) ?? 'NaN')
const waterSetting = async () =>
  (await editorDoc(page)).operatingPoints[0].inlets.find((i: any) => i.portId === 'water-in')

describe('pressure-driven inlets in the editor', () => {
  it('switches the water inlet to pressure at the pressure it needs: its flow stays 5 µL/min', async () => {
    await expect.poll(() => number('flow', 'water-in')).toBeCloseTo(5, 3)
    const needed = await number('pressure', 'water-in')
    expect(needed).toBeGreaterThan(0)
    await page.selectOption('[data-test="inlet-mode-water-in"]', 'pressure')
    await expect.poll(async () => (await waterSetting()).mode).toBe('pressure')
    const setting = await waterSetting()
    expect(setting.unit).toBe('mbar')
    expect(setting.value).toBeCloseTo(needed, 6)
    // Three significant figures of the needed pressure give back the flow within 1 %.
    await expect.poll(async () => Math.abs((await number('flow', 'water-in')) - 5)).toBeLessThan(0.05)
    await shot(page, 'editor-inlet-pressure')
  })

  it('refuses −1 mbar beside the field and keeps what was typed; the document is unchanged', async () => {
    const before = await waterSetting()
    await page.fill('[data-test="inlet-value-water-in"]', '-1')
    await page.press('[data-test="inlet-value-water-in"]', 'Enter')
    await expect
      .poll(() => page.locator('[data-test="inlet-error-water-in"]').textContent())
      .toContain('Inlet pressure must be ≥ 0')
    expect(await page.inputValue('[data-test="inlet-value-water-in"]')).toBe('-1')
    expect(await waterSetting()).toEqual(before)
  })

  it('marks an inlet whose pressure exceeds the bond limit', async () => {
    await page.fill('[data-test="inlet-value-water-in"]', '2500')
    await page.press('[data-test="inlet-value-water-in"]', 'Enter')
    await expect.poll(async () => (await waterSetting()).value).toBe(2500)
    await expect.poll(() => cell('pressure', 'water-in').getAttribute('class')).toContain('text-fault-500')
    expect(await page.locator('[data-test="inlet-error-water-in"]').count()).toBe(0)
  })
})
