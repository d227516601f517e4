// The lab admin's Jobs page in Chromium: a failed background job of the lab is listed with its error and tries.
import { randomUUID } from 'node:crypto'
import pg from 'pg'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { closeDb } from '../../server/utils/db'
import { enqueueJob } from '../../server/utils/jobs'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { makeLab, TEST_PASSWORD } from '../support/factory'

let browser: Browser
const pool = new pg.Pool({ connectionString: inject('databaseUrl'), max: 1 })
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
  await pool.end()
  await closeDb()
})

describe('failed background jobs in Chromium', () => {
  it("shows a lab admin the lab's failed job, its error and its tries, from the menu", async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const marker = randomUUID()
    const id = await enqueueJob(
      'diagnostic.fail',
      { labId: lab.id, marker, message: 'Micrograph 14 could not be decoded' },
      { retryLimit: 0 },
    )
    await expect
      .poll(
        async () =>
          (await pool.query(`select state from pgboss.job where id = $1 and name = 'diagnostic.fail'`, [id])).rows[0]
            ?.state,
        { timeout: 15_000 },
      )
      .toBe('failed')

    const page = await newPage(browser)
    await signInAs(page, admin!.email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.goto(`/labs/${lab.id}`)
    await hydrated(page)
    await page.click('[data-test="nav-jobs"]')
    await page.waitForSelector(`[data-test="job-${id}"]`)
    const row = await page.textContent(`[data-test="job-${id}"]`)
    expect(row).toContain('Micrograph 14 could not be decoded')
    expect(row).toContain('failed for good')
    expect(row).toMatch(/1 of 1/)
    await shot(page, 'jobs-failed')
  })
})
