// "Plan a new generator" on the lab's own process, in Chromium: the process list offers it beside the built-in
// ones, the geometry is checked against its values (a coarse process refuses what the film mask accepts), and a
// design created from a suggestion on a fine lab process opens in the editor checked against that process.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'

// Invented values: a coarse and a fine process of the lab's own.
const PROCESS = {
  kind: 'process',
  source: 'measured in our lab',
  material: 'PDMS',
  maxWidthToDepth: 20,
  maxWallDepthToWidth: 4,
  portEdgeDistance: 1000,
  portSpacing: 1000,
  bondPressureLimitMbar: 1800,
  maxDepth: 250,
}
const COARSE = {
  ...PROCESS,
  key: 'coarse',
  name: 'Our coarse moulding process',
  minFeature: 40,
  minGap: 40,
  minDepth: 20,
}
const FINE = { ...PROCESS, key: 'fine', name: 'Our fine SU-8 process', minFeature: 4, minGap: 4, minDepth: 2 }

let browser: Browser
let page: Page
let labId: string

beforeAll(async () => {
  browser = await launch()
  const { lab, people } = await makeLab(['admin', 'designer'])
  labId = lab.id
  const admin = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
  for (const p of [COARSE, FINE]) {
    const res = await admin.post(`/api/labs/${labId}/libraries`, p)
    if (res.status !== 201) throw new Error(`library entry: ${res.status} ${JSON.stringify(res.json)}`)
  }
  page = await newPage(browser)
  await signInAs(page, people[1]!.email, TEST_PASSWORD)
  await page.waitForURL(/\/labs\//)
})
afterAll(async () => {
  await browser?.close()
})

async function suggest(processId: string) {
  await page.selectOption('[data-test="planner-process"]', processId)
  await page.fill('[data-test="planner-diameter"]', '25')
  await page.fill('[data-test="planner-rate"]', '5000')
  await page.click('[data-test="planner-run"]')
}

describe("Plan a new generator on the lab's process", () => {
  it("lists the lab's processes, checks the geometry against them, and the design opens on that process", async () => {
    await page.goto(`/labs/${labId}/plan`)
    await page.waitForSelector('[data-test="planner-new"]')
    await hydrated(page)
    await expect
      .poll(() => page.locator('[data-test="planner-process"] option').allTextContents())
      .toEqual([
        'Film-mask soft lithography (PDMS on glass)',
        'Chrome-mask soft lithography (PDMS on glass)',
        'Our coarse moulding process (lab)',
        'Our fine SU-8 process (lab)',
      ])

    // 25 µm drops need a 6.25 µm deep step (d ≈ 4h, Dangla, Kayi & Baroud 2013): below the coarse process's 20 µm.
    await suggest('lab-coarse')
    const step = page.locator('[data-test="planner-geometry-step"]')
    await expect
      .poll(() => step.textContent().catch(() => ''), { timeout: 30_000 })
      .toContain("Our coarse moulding process: depth 6.25 µm is below the process's 20 µm")
    expect(await page.locator('[data-test="planner-create-step"]').isDisabled()).toBe(true)
    await shot(page, 'planner-lab-coarse')

    await suggest('lab-fine')
    await expect.poll(() => step.textContent(), { timeout: 30_000 }).not.toContain('Our coarse')
    expect(await step.textContent()).toContain('process accepts it')
    await page.click('[data-test="planner-create-step"]')
    await page.waitForURL(/\/designs\/[^/]+\/edit$/)
    await page.waitForSelector('[data-test="editor-canvas"] canvas')
    await expect
      .poll(() => page.textContent('body'), { timeout: 15_000 })
      .toContain('Checked against Our fine SU-8 process')
    await expect
      .poll(() => page.locator('[data-test="findings-count"]').textContent(), { timeout: 15_000 })
      .toMatch(/^0 errors/)
    await shot(page, 'planner-lab-fine-design')
  }, 120_000)
})
