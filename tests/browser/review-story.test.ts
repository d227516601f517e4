// The review story as people would live it, in Chromium: three saves, two pinned comments and a change request,
// fixes, approval, release, the fabricator's download, and a duplicate that remembers its origin.
import { writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'
import { invitationLink, waitForMail } from '../support/mail'

let browser: Browser
let lab: Awaited<ReturnType<typeof makeLab>>
const who = (role: string) => lab.people.find(p => p.role === role)!
beforeAll(async () => {
  browser = await launch()
  lab = await makeLab(['admin', 'designer', 'reviewer', 'experimenter', 'fabricator'])
})
afterAll(async () => {
  await browser?.close()
})

// The reviewer of this story joins by an e-mail invitation (first test); everyone else was made by the factory.
const invited = {
  email: `story-reviewer-${Date.now()}@invited.example`,
  name: 'Priya Story-Reviewer',
  password: 'review-pass-2026',
}

async function as(role: string): Promise<Page> {
  const page = await newPage(browser)
  if (role === 'reviewer') await signInAs(page, invited.email, invited.password)
  else await signInAs(page, who(role).email, TEST_PASSWORD)
  await page.waitForURL(/\/labs\//)
  await hydrated(page)
  return page
}

function documentFile(mainWidth: number): string {
  const doc = fixtureDocument()
  doc.components[0].mainWidth = mainWidth
  const path = join(tmpdir(), `dw-story-${mainWidth}-${Date.now()}.json`)
  writeFileSync(path, JSON.stringify(doc))
  return path
}

async function uploadRevision(page: Page, mainWidth: number, message: string) {
  await page.setInputFiles('[data-test="upload-revision"] input[type=file]', documentFile(mainWidth))
  await page.fill('[data-test="upload-revision"] input.field', message)
  await page.click('[data-test="upload-revision"] button')
  await expect.poll(() => page.locator('[data-test="revisions-table"]').textContent()).toContain(message)
}

async function pinComment(page: Page, fx: number, fy: number, text: string, shown: string) {
  await page.click('[data-test="pin-mode"]')
  // Pin mode brings the drawing into view (it sits above the comments).
  await expect
    .poll(async () => {
      const b = (await page.locator('canvas').first().boundingBox())!
      return b.y >= 0 && b.y + b.height <= page.viewportSize()!.height
    })
    .toBe(true)
  const box = (await page.locator('canvas').first().boundingBox())!
  await page.mouse.click(box.x + box.width * fx, box.y + box.height * fy)
  await page.fill('[data-test="pin-form"] textarea', text)
  await page.click('[data-test="pin-form"] button:has-text("Pin comment")')
  await expect
    .poll(() => page.locator('[data-test^="thread-"]').allTextContents())
    .toEqual(expect.arrayContaining([expect.stringContaining(shown)]))
}

describe('review story in Chromium', () => {
  let designUrl = ''

  it('the admin invites the reviewer by e-mail, who joins through the link', async () => {
    const admin = await as('admin')
    await admin.goto(`/labs/${lab.lab.id}/members`)
    await hydrated(admin)
    await admin.fill('#invite-email', invited.email)
    await admin.selectOption('#invite-role', 'reviewer')
    await admin.click('[data-test="invite-submit"]')
    await expect.poll(() => admin.textContent('[data-test="invite-sent"]').catch(() => null)).toContain(invited.email)
    const { path } = invitationLink(await waitForMail(invited.email))
    const guest = await newPage(browser)
    await guest.goto(path)
    await hydrated(guest)
    await guest.fill('#account-name', invited.name)
    await guest.fill('#account-password', invited.password)
    await guest.click('[data-test="accept-submit"]')
    await guest.waitForURL(new RegExp(`/labs/${lab.lab.id}$`))
    await expect.poll(() => guest.textContent('[data-test="lab-role"]')).toBe('Reviewer')
  })

  it('a designer creates a design and saves three revisions', async () => {
    const page = await as('designer')
    await page.goto(`/labs/${lab.lab.id}/designs`)
    await page.click('[data-test="new-design"]')
    await page.fill('[data-test="design-create"] input[name=name]', 'Story chip')
    await page.click('[data-test="design-create"] button[type=submit]')
    await page.waitForSelector('[data-test="revisions-table"]')
    designUrl = new URL(page.url()).pathname
    await uploadRevision(page, 90, 'Main channel 90 µm')
    await uploadRevision(page, 80, 'Main channel 80 µm')
    expect(await page.locator('[data-test^="revision-r"]').count()).toBe(3)
    await page.click('[data-test="revision-r3"]')
    await page.waitForSelector('[data-test="request-review"]')
    await page.check(`[data-test="request-review"] label:has-text("${invited.name}") input`)
    await page.click('[data-test="request-review"] button')
    await expect.poll(() => page.textContent('[data-test="review-panel"]')).toContain('In review')
    expect(await page.textContent('[data-test="bond-margin"]')).toMatch(/Bond limit 2000 mbar: margin \d/)
    await shot(page, 'story-1-designer-r3')
  })

  it('the reviewer pins two comments on the geometry and requests changes', async () => {
    const page = await as('reviewer')
    await page.goto(designUrl)
    await hydrated(page)
    await page.click('[data-test="revision-r3"]')
    await page.waitForSelector('canvas')
    await hydrated(page)
    await pinComment(page, 0.5, 0.45, 'This junction, **narrower**', 'This junction, narrower')
    await pinComment(page, 0.2, 0.45, 'Move this punch <script>window.hacked=1</script> inward', 'Move this punch')
    expect(await page.evaluate(() => (window as unknown as { hacked?: number }).hacked)).toBeUndefined()
    expect(await page.locator('[data-test="comment-body"] strong').first().textContent()).toBe('narrower')
    await page.click('[data-test="request-changes"]')
    await expect.poll(() => page.textContent('[data-test="review-panel"]')).toContain('Changes requested')
    await shot(page, 'story-2-reviewer-pins')
  })

  it('the designer resolves both, saves a fix and asks again; the reviewer approves', async () => {
    const page = await as('designer')
    await page.goto(designUrl)
    await hydrated(page)
    await page.click('[data-test="revision-r3"]')
    await page.waitForSelector('[data-test="thread-2"]')
    for (const i of [1, 2]) {
      await page.click(`[data-test="thread-${i}"] [data-test="resolve"]`)
      await page.waitForSelector(`[data-test="thread-${i}"] [data-test="reopen"]`)
    }
    await page.goto(designUrl)
    await hydrated(page)
    await uploadRevision(page, 70, 'Narrower junction, punch moved, per review')
    await page.click('[data-test="revision-r4"]')
    await page.check(`[data-test="request-review"] label:has-text("${invited.name}") input`)
    await page.click('[data-test="request-review"] button')
    await expect.poll(() => page.textContent('[data-test="review-panel"]')).toContain('In review')

    const reviewer = await as('reviewer')
    await reviewer.goto(page.url())
    await hydrated(reviewer)
    await reviewer.click('[data-test="approve"]')
    await expect.poll(() => reviewer.textContent('[data-test="review-panel"]')).toContain('Approved')
  })

  it('the admin releases; the fabricator downloads the mask and sees nothing else', async () => {
    const admin = await as('admin')
    await admin.goto(designUrl)
    await hydrated(admin)
    await admin.click('[data-test="revision-r4"]')
    await admin.click('[data-test="release"]')
    await admin.click('[data-test="release-review"]') // the order form, then the confirmation (a release cannot be undone)
    await admin.click('[data-test="release-confirm-yes"]')
    await admin.waitForSelector('[data-test="release-info"]')

    const fab = await as('fabricator')
    expect(await fab.locator('[data-test="nav-designs"]').count()).toBe(0)
    await fab.click('[data-test="nav-releases"]')
    await fab.click('[data-test="released-Story chip"]')
    await fab.waitForSelector('[data-test="dxf-link"]')
    const [download] = await Promise.all([fab.waitForEvent('download'), fab.click('[data-test="dxf-link"]')])
    expect(download.suggestedFilename()).toBe('story-chip_r4_all-layers.dxf')
    await shot(fab, 'story-3-fabricator-release')
    await fab.goto(designUrl)
    await hydrated(fab)
    await expect.poll(() => fab.textContent('[data-test="error-page"]')).toContain('Not allowed')
  })

  it('a lab member duplicates the approved design and the copy shows its origin', async () => {
    const page = await as('experimenter')
    await page.goto(designUrl)
    await hydrated(page)
    await page.fill('[data-test="duplicate-form"] input', 'Story chip, bench copy')
    await page.click('[data-test="duplicate-form"] button')
    await page.waitForSelector('[data-test="design-origin"]')
    expect(await page.textContent('[data-test="design-origin"]')).toMatch(/Story chip[\s\S]*r4/)
    await shot(page, 'story-4-duplicate-origin')
  })
})
