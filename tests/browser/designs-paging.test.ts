// The designs page pages through a long list in Chromium: 50 a page, the range and the page in the URL (a reload
// keeps it), a new search back to page 1.
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { designs } from '../../server/db/schema'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
let page: Page
let labId: string
const rows = () => page.locator('[data-test="designs-table"] tbody tr').count()

beforeAll(async () => {
  const { lab, people } = await makeLab(['designer'])
  labId = lab.id
  // 56 designs straight into the database (the list needs no revision to show a row).
  const pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 1 })
  await drizzle(pool)
    .insert(designs)
    .values(
      Array.from({ length: 56 }, (_, i) => ({
        labId,
        name: `Array chip ${String(i + 1).padStart(2, '0')}`,
        createdBy: people[0]!.id,
        updatedAt: new Date(Date.UTC(2026, 0, 1, 0, i)),
      })),
    )
  await pool.end()
  browser = await launch()
  page = await newPage(browser)
  await signInAs(page, people[0]!.email, TEST_PASSWORD)
  await page.waitForURL(/\/labs\//)
})
afterAll(async () => {
  await browser?.close()
})

describe('designs list pages', () => {
  it('shows 50 of 56, moves to page 2, keeps it in the URL across a reload, and a search starts at page 1', async () => {
    await page.goto(`/labs/${labId}/designs?sort=name&dir=asc`)
    await hydrated(page)
    await expect.poll(() => page.locator('[data-test="designs-range"]').textContent()).toContain('Designs 1–50 of 56')
    expect(await rows()).toBe(50)
    await page.click('[data-test="designs-next"]')
    await page.waitForURL(/page=2/)
    await expect.poll(() => page.locator('[data-test="designs-range"]').textContent()).toContain('Designs 51–56 of 56')
    expect(await rows()).toBe(6)
    await expect
      .poll(() => page.locator('[data-test="designs-table"] tbody tr a').first().textContent())
      .toBe('Array chip 51')
    await shot(page, 'designs-paging')
    await page.reload()
    await hydrated(page)
    expect(await page.locator('[data-test="designs-range"]').textContent()).toContain('Designs 51–56 of 56')
    expect(await page.locator('[data-test="designs-table"] tbody tr a').first().textContent()).toBe('Array chip 51')
    await page.fill('[data-test="designs-search"]', 'chip 0')
    await expect.poll(() => page.locator('[data-test="designs-range"]').textContent()).toContain('Designs 1–9 of 9')
    expect(page.url()).not.toMatch(/page=/)
    expect(await page.isDisabled('[data-test="designs-next"]').catch(() => true)).toBe(true)
  })
})
