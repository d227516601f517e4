// The Libraries page in Chromium: an admin adds a lab liquid (a refused number says so beside its field, nothing
// typed is lost), the entry appears marked with its source; a designer reads it without edit buttons; the
// new-design form offers the starter chips and the lab's process.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { ApiClient } from '../support/api'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
let admin: Page
let designer: Page
let labId: string
let adminApi: ApiClient
let designerApi: ApiClient

beforeAll(async () => {
  browser = await launch()
  const { lab, people } = await makeLab(['admin', 'designer'])
  labId = lab.id
  admin = await newPage(browser)
  await signInAs(admin, people[0]!.email, TEST_PASSWORD)
  await admin.waitForURL(/\/labs\//)
  adminApi = await new ApiClient().signIn(people[0]!.email, TEST_PASSWORD)
  designerApi = await new ApiClient().signIn(people[1]!.email, TEST_PASSWORD)
  designer = await newPage(browser)
  await signInAs(designer, people[1]!.email, TEST_PASSWORD)
  await designer.waitForURL(/\/labs\//)
})
afterAll(async () => {
  await browser?.close()
})

describe('libraries page', () => {
  it('an admin adds a liquid; a refused value is named beside its field and kept', async () => {
    await admin.goto(`/labs/${labId}/libraries`)
    await hydrated(admin)
    await admin.click('[data-test="library-add-liquid"]')
    const form = admin.locator('[data-test="library-form-liquid"]')
    await form.locator('input[name="name"]').fill('Bench oil, lot 9')
    await form.locator('input[name="key"]').fill('bench-oil-9')
    await form.locator('input[name="table.0.viscosityMPaS"]').fill('-3')
    await form.locator('input[name="table.0.densityKgPerM3"]').fill('815')
    await admin.click('[data-test="library-save"]')
    await expect
      .poll(() => form.locator('[role="alert"]').first().textContent())
      .toContain('Viscosity must be above 0 mPa·s')
    expect(await form.locator('input[name="name"]').inputValue()).toBe('Bench oil, lot 9')
    await form.locator('input[name="table.0.viscosityMPaS"]').fill('3.4')
    await admin.click('[data-test="library-add-row"]')
    await form.locator('input[name="table.1.temperatureC"]').fill('37')
    await form.locator('input[name="table.1.viscosityMPaS"]').fill('2.5')
    await form.locator('input[name="table.1.densityKgPerM3"]').fill('803')
    await admin.click('[data-test="library-save"]')
    const row = admin.locator('[data-test="library-entry-lab-bench-oil-9"]')
    await row.waitFor()
    expect(await row.textContent()).toContain('measured in our lab')
    expect(await row.textContent()).toContain('20 °C: 3.4 mPa·s, 815 kg/m³')
    await shot(admin, 'libraries-admin')
  })

  it('a designer reads the library without edit buttons, and the new-design form offers the starters', async () => {
    await designer.goto(`/labs/${labId}/libraries`)
    await hydrated(designer)
    await designer.locator('[data-test="library-entry-lab-bench-oil-9"]').waitFor()
    expect(await designer.locator('[data-test="library-read-only"]').count()).toBe(1)
    expect(await designer.locator('[data-test="library-edit-lab-bench-oil-9"]').count()).toBe(0)
    await designer.goto(`/labs/${labId}/designs`)
    await hydrated(designer)
    await designer.click('[data-test="new-design"]')
    await designer.locator('[data-test="starter-step-emulsifier"]').check()
    await designer.fill('input[name="name"]', 'Step starter from the form')
    await shot(designer, 'libraries-new-design')
    await designer.click('[data-test="design-create-submit"]')
    await designer.waitForURL(/\/designs\/[0-9a-f-]{36}/)
  })

  it('the editor lists the lab oil marked (lab); the revision page re-forecasts with the current library and shows the difference', async () => {
    const pair = await adminApi.post(`/api/labs/${labId}/libraries`, {
      kind: 'pair',
      liquids: ['water', 'lab-bench-oil-9'],
      surfactant: 'bench-mix',
      interfacialTensionMNPerM: 4,
      source: 'measured in our lab',
    })
    expect(pair.status).toBe(201)
    const doc = fixtureDocument()
    doc.operatingPoints[0].continuousLiquid = { liquid: 'lab-bench-oil-9' }
    doc.operatingPoints[0].surfactant = 'bench-mix'
    const made = await designerApi.post(`/api/labs/${labId}/designs`, { name: 'Bench oil chip', document: doc })
    expect(made.status).toBe(201)

    await designer.goto(`/labs/${labId}/designs/${made.json.designId}/edit`)
    await hydrated(designer)
    await designer.waitForSelector('[data-test="editor-canvas"] canvas')
    await expect
      .poll(() => designer.locator('[data-test="op-continuous"] option', { hasText: 'Bench oil, lot 9 (lab)' }).count())
      .toBe(1)
    expect(await designer.locator('[data-test="op-continuous"]').inputValue()).toBe('lab-bench-oil-9')

    expect(
      (
        await adminApi.patch(`/api/labs/${labId}/libraries/${pair.json.id}`, {
          kind: 'pair',
          liquids: ['water', 'lab-bench-oil-9'],
          surfactant: 'bench-mix',
          interfacialTensionMNPerM: 2,
          source: 'measured in our lab',
        })
      ).status,
    ).toBe(200)
    await designer.goto(`/labs/${labId}/revisions/${made.json.revisionId}`)
    await hydrated(designer)
    expect(await designer.locator('[data-test="snapshot-tension"]').textContent()).toContain(
      "γ = 4 mN/m (the lab's library)",
    )
    await designer.click('[data-test="reforecast-run"]')
    const table = designer.locator('[data-test="reforecast-differences"]')
    await table.waitFor()
    expect(await table.textContent()).toContain('Interfacial tension')
    await shot(designer, 'libraries-reforecast')
  })
})
