// The fabrication handoff as people do it: the admin releases with an order and a confirmation; the fabricator
// finds the order in the queue, starts it and ships it with a tracking number.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, memberEmails, shot, signedInPage } from '../support/browser'
import { labWithDesign } from '../support/designs'
import { TEST_PASSWORD } from '../support/factory'

let browser: Browser
let c: Awaited<ReturnType<typeof labWithDesign>>
let emails: Record<string, string>
beforeAll(async () => {
  browser = await launch()
  c = await labWithDesign()
  const base = `/api/labs/${c.lab.id}/revisions/${c.revisionId}`
  await c.as.designer.post(`${base}/review-requests`, { reviewerIds: [c.ids.reviewer] })
  await c.as.reviewer.post(`${base}/verdicts`, { verdict: 'approve' })
  emails = await memberEmails(c.as.admin, c.lab.id)
}, 120_000)
afterAll(async () => {
  await browser?.close()
})

const as = (role: string): Promise<Page> => signedInPage(browser, emails[role]!, TEST_PASSWORD)

describe('release with an order, then the fab ships it (real Chromium)', () => {
  it('admin confirms the release; fabricator moves the order to shipped with a tracking number', async () => {
    const admin = await as('admin')
    await admin.goto(`/labs/${c.lab.id}/revisions/${c.revisionId}`)
    await hydrated(admin)
    await admin.click('[data-test="release"]')
    await admin.fill('[data-test="order-quantity"]', '8')
    await admin.fill('[data-test="order-po"]', 'PO-2027-031')
    await admin.selectOption('[data-test="order-medium"]', 'chrome')
    await admin.click('[data-test="release-review"]')
    // Nothing is released before the confirmation: it says that it cannot be undone.
    expect(await admin.textContent('[data-test="release-confirm"]')).toContain('cannot be undone')
    expect((await c.as.admin.get(`/api/labs/${c.lab.id}/orders`)).json).toEqual([])
    await shot(admin, 'fab-1-release-confirm')
    await admin.click('[data-test="release-confirm-yes"]')
    await admin.waitForSelector('[data-test="release-info"]')
    expect(await admin.textContent('[data-test="release-info"]')).toContain('Received by the fab, not started')

    const fab = await as('fabricator')
    await fab.click('[data-test="nav-orders"]')
    await fab.click('[data-test="order-1"]')
    await fab.waitForSelector('[data-test="order-detail"]')
    expect(await fab.textContent('[data-test="order-detail"]')).toContain('PO-2027-031')
    await fab.click('[data-test="move-in-fabrication"]')
    await fab.click('[data-test="move-confirm"]')
    await expect.poll(() => fab.textContent('[data-test="order-status"]')).toBe('Being made')
    await fab.click('[data-test="move-shipped"]')
    await fab.fill('[data-test="tracking-number"]', 'QX-5512-77')
    await fab.fill('[data-test="move-note"]', 'Eight chips, two spare')
    await fab.click('[data-test="move-confirm"]')
    await expect.poll(() => fab.textContent('[data-test="order-status"]')).toBe('Shipped')
    expect(await fab.textContent('[data-test="order-tracking"]')).toBe('QX-5512-77')
    expect(await fab.textContent('[data-test="order-thread"]')).toContain('Tracking number: QX-5512-77')
    await shot(fab, 'fab-2-order-shipped')
  }, 120_000)
})
