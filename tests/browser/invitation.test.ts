import { randomUUID } from 'node:crypto'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, shot, signInAs } from '../support/browser'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { invitationLink, waitForMail } from '../support/mail'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
})

describe('invitations in Chromium', () => {
  it('an admin invites by e-mail; the invited person follows the link, creates an account and lands in the lab', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin', 'designer'])
    const email = `ines-${randomUUID().slice(0, 8)}@invited.example`

    const page = await newPage(browser)
    await signInAs(page, admin!.email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.goto(`/labs/${lab.id}/members`)
    await hydrated(page)
    await page.fill('#invite-email', 'not an address')
    await page.click('[data-test="invite-submit"]')
    await expect.poll(() => page.textContent('[data-test="invite-form"]')).toContain('Enter an e-mail address')
    await page.fill('#invite-email', email)
    await page.selectOption('#invite-role', 'reviewer')
    await page.click('[data-test="invite-submit"]')
    await expect.poll(() => page.textContent('[data-test="invite-sent"]').catch(() => null)).toContain(email)
    expect(await page.textContent(`[data-test="invitation-${email}"]`)).toContain('Reviewer')
    await shot(page, 'invite-form')

    const mail = await waitForMail(email)
    const { path } = invitationLink(mail)

    const guest = await newPage(browser) // a fresh context: nobody signed in
    await guest.goto(path)
    await hydrated(guest)
    await expect.poll(() => guest.textContent('[data-test="invitation-lab"]')).toBe(lab.name)
    expect(await guest.textContent('[data-test="invitation-role"]')).toBe('Reviewer')
    expect(await guest.inputValue('#account-email')).toBe(email)
    await guest.fill('#account-name', 'Ines Varro')
    await guest.fill('#account-password', 'short')
    await guest.click('[data-test="accept-submit"]')
    await expect.poll(() => guest.textContent('[data-test="new-account-form"]')).toContain('at least 10 characters')
    await shot(guest, 'invitation-accept')
    await guest.fill('#account-password', 'a-long-enough-pass')
    await guest.click('[data-test="accept-submit"]')
    await guest.waitForURL(new RegExp(`/labs/${lab.id}$`))
    await expect.poll(() => guest.textContent('[data-test="lab-name"]')).toBe(lab.name)
    expect(await guest.textContent('[data-test="lab-role"]')).toBe('Reviewer')
    expect(await guest.textContent('[data-test="signed-in-as"]')).toBe('Ines Varro')

    // The link is used up now.
    const late = await newPage(browser)
    await late.goto(path)
    await expect.poll(() => late.textContent('[data-test="invitation-invalid"]')).toContain('already been used')

    // The admin sees the message in the development outbox, and the invitation is no longer open.
    await page.click('[data-test="nav-outbox"]')
    await page.waitForURL(/\/outbox$/)
    await expect
      .poll(() => page.textContent(`[data-test="outbox-message-${email}"]`).catch(() => null))
      .toContain(lab.name)
    await page.click(`[data-test="outbox-message-${email}"] summary`)
    await shot(page, 'outbox')
    await page.click('[data-test="nav-members"]')
    await expect.poll(() => page.textContent(`[data-test="member-${email}"]`).catch(() => null)).toContain('Ines Varro')
    expect(await page.$(`[data-test="invitation-${email}"]`)).toBeNull()
  })

  it('sends someone with an account to sign in first, then lets them join', async () => {
    const {
      lab,
      people: [admin],
    } = await makeLab(['admin'])
    const {
      people: [existing],
    } = await makeLab(['designer'])
    const page = await newPage(browser)
    await signInAs(page, admin!.email, TEST_PASSWORD)
    await page.waitForURL(/\/labs\//)
    await page.goto(`/labs/${lab.id}/members`)
    await hydrated(page)
    await page.fill('#invite-email', existing!.email)
    await page.click('[data-test="invite-submit"]')
    await expect.poll(() => page.textContent('[data-test="invite-sent"]').catch(() => null)).toContain(existing!.email)
    const { path } = invitationLink(await waitForMail(existing!.email))

    const guest = await newPage(browser)
    await guest.goto(path)
    await hydrated(guest)
    await guest.click('[data-test="accept-sign-in"]')
    await guest.waitForURL(/\/sign-in\?redirect=/)
    await hydrated(guest)
    await guest.fill('#email', existing!.email)
    await guest.fill('#password', TEST_PASSWORD)
    await guest.click('button[type=submit]')
    await guest.waitForURL(new RegExp(`${path}$`))
    await guest.waitForSelector('[data-test="accept-join"]')
    await guest.click('[data-test="accept-join"]')
    await guest.waitForURL(new RegExp(`/labs/${lab.id}$`))
    await expect.poll(() => guest.textContent('[data-test="lab-role"]')).toBe('Designer')
  })

  it('hides the outbox from someone who is not an admin', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'designer@quillmere.example')
    await page.waitForURL(/\/labs\//)
    await page.waitForSelector('[data-test="nav-members"]')
    expect(await page.$('[data-test="nav-outbox"]')).toBeNull()
  })
})
