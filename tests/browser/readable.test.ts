// Issue 16 read as each role reads it: the lab overview says what waits for me, a fabricator lands on their
// released work, and the revision page's numbers follow the formatting rules (no "e+2", prefixes, one spelling).
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { ApiClient } from '../support/api'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
let labId = ''
let revisionUrl = ''
const emails: Record<string, string> = {}
beforeAll(async () => {
  browser = await launch()
  const { lab, people } = await makeLab(['designer', 'reviewer', 'fabricator'])
  for (const p of people) emails[p.role] = p.email
  labId = lab.id
  const designer = await new ApiClient().signIn(emails.designer!, TEST_PASSWORD)
  const created = await designer.post(`/api/labs/${lab.id}/designs`, {
    name: 'Overview drops',
    document: fixtureDocument(),
  })
  expect(created.status).toBe(201)
  revisionUrl = `/labs/${lab.id}/revisions/${created.json.revisionId}`
  const reviewerId = people.find(p => p.role === 'reviewer')!.id
  expect(
    (
      await designer.post(`/api/labs/${lab.id}/revisions/${created.json.revisionId}/review-requests`, {
        reviewerIds: [reviewerId],
      })
    ).status,
  ).toBe(200)
})
afterAll(async () => {
  await browser?.close()
})

async function as(role: string, width = 1440): Promise<Page> {
  const page = await newPage(browser)
  await page.setViewportSize({ width, height: 900 })
  await signInAs(page, emails[role]!, TEST_PASSWORD)
  await page.waitForURL(/\/labs\//)
  return page
}

describe('flow of work and numbers as the trade writes them', () => {
  it("the reviewer's lab overview lists the revision waiting for their review and the recent design", async () => {
    for (const width of [1440, 1024]) {
      const page = await as('reviewer', width)
      await page.goto(`/labs/${labId}`)
      await hydrated(page)
      await expect.poll(() => page.locator('[data-test="inbox-waiting"]').textContent()).toContain('Overview drops r1')
      expect(await page.locator('[data-test="inbox-recent"]').textContent()).toContain('Overview drops')
      await shot(page, `readable-overview-${width}`)
      await page.close()
    }
  })

  it('a fabricator lands on the released work, not an empty overview', async () => {
    const page = await as('fabricator')
    await page.goto(`/labs/${labId}`)
    await page.waitForURL(/\/releases$/)
    expect(await page.locator('h1').textContent()).toContain('Released for fabrication')
    await page.close()
  })

  it('the revision page writes every number by the rules: no exponents, units, "mould"', async () => {
    for (const width of [1440, 1024]) {
      const page = await as('reviewer', width)
      await page.goto(revisionUrl)
      await hydrated(page)
      const forecast = page.locator('[data-test="revision-forecast"]')
      await expect.poll(() => forecast.textContent()).toMatch(/T-junction “tj-1”/)
      const text = (await page.locator('main').textContent()) ?? ''
      expect(text).not.toMatch(/\de[+-]\d/)
      expect(text).not.toMatch(/\bmold\b/i)
      expect(text).toContain('Mirror for the mould')
      expect(await forecast.textContent()).toMatch(/\d (µm|mm)/)
      await shot(page, `readable-revision-${width}`)
      await page.close()
    }
  })
})
