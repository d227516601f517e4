// Issue 16, the final walk as each role at 1440 and 1024 px wide, kept as checks of what was seen wrong on screen:
// the header wrapped the admin's name and "Sign out" onto three lines; the members page wrote "2026-12-03" and the
// libraries page "03/12/2026" beside "3 Dec 2026" elsewhere; the token form squeezed its Name box to a sliver; the
// demo fabrication order said "since 4 Dec" on 3 Dec. The demo accounts of the seeded test database walk here.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { hydrated, launch, signInAs } from '../support/browser'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
})
afterAll(async () => {
  await browser?.close()
})

async function demoPage(email: string, width: number): Promise<{ page: Page; labId: string }> {
  const context = await browser.newContext({
    baseURL: inject('baseURL'),
    viewport: { width, height: width === 1440 ? 900 : 768 },
  })
  const page = await context.newPage()
  await signInAs(page, email)
  await page.waitForURL(/\/labs\//)
  await hydrated(page)
  const labs = (await (await page.request.get('/api/labs')).json()) as Array<{ labId: string; name: string }>
  return { page, labId: labs.find(l => l.name.startsWith('Quillmere'))!.labId }
}

/** Every entry of the header: its height, and whether the bar's content fits its width. */
const headerBoxes = (page: Page) =>
  page.evaluate(() => {
    const bar = document.querySelector('header > div') as HTMLElement
    const items = [...bar.querySelectorAll('a, button, select')].map(e => ({
      text: (e.textContent ?? '').trim().slice(0, 30),
      height: e.getBoundingClientRect().height,
      right: e.getBoundingClientRect().right,
    }))
    return { items, overflow: bar.scrollWidth - bar.clientWidth, viewport: window.innerWidth }
  })

/** The day a person reads ("3 Dec 2026", "Dec 3, 2026" …), never a machine's date. */
const MACHINE_DATE = /^\d{4}-\d{2}-\d{2}|^\d{1,2}\/\d{1,2}\/\d{2,4}$/
const READ_DAY = /\b(19|20)\d{2}\b/

describe('the walk at 1440 and 1024 px wide', () => {
  for (const width of [1440, 1024]) {
    it(`${width} px: the admin's header is one line, dates read as days, the token form has room for a name`, async () => {
      const { page, labId } = await demoPage('admin@quillmere.example', width)
      await page.goto(`/labs/${labId}/members`)
      await hydrated(page)
      const header = await headerBoxes(page)
      expect(header.items.length, 'the admin sees the whole lab menu').toBeGreaterThanOrEqual(9)
      for (const item of header.items) expect(item.height, `"${item.text}" on one line`).toBeLessThanOrEqual(34)
      expect(header.overflow).toBeLessThanOrEqual(0)
      expect(Math.max(...header.items.map(i => i.right))).toBeLessThanOrEqual(header.viewport)

      const since = await page.locator('[data-test="members-table"] tbody td:nth-child(4)').allTextContents()
      expect(since.length).toBeGreaterThanOrEqual(5)
      for (const s of since) {
        expect(s.trim()).not.toMatch(MACHINE_DATE)
        expect(s).toMatch(READ_DAY)
      }

      await page.goto(`/labs/${labId}/libraries`)
      await hydrated(page)
      const changed = await page.locator('[data-test^="library-entry-"] td:nth-child(5)').allTextContents()
      expect(changed.length).toBeGreaterThanOrEqual(2)
      for (const c of changed) expect(c.split('·')[0]!.trim()).not.toMatch(MACHINE_DATE)

      await page.goto('/account')
      await hydrated(page)
      const name = await page.locator('#token-name').boundingBox()
      expect(name!.width, 'the token name box').toBeGreaterThanOrEqual(150)
      await page.context().close()
    })
  }

  it("1024 px: the revision page's forecast keeps each number with its unit on one line", async () => {
    const { page, labId } = await demoPage('reviewer@quillmere.example', 1024)
    const designs = (await (await page.request.get(`/api/labs/${labId}/designs?q=flow-focuser`)).json()) as {
      items?: Array<{ id: string; latestRevisionId: string }>
    }
    const listed = JSON.stringify(designs)
    const revisionId =
      /"latestRevisionId":"([^"]+)"/.exec(listed)?.[1] ?? /"latestRevision":\{"id":"([^"]+)"/.exec(listed)?.[1]
    expect(revisionId, listed.slice(0, 300)).toBeTruthy()
    await page.goto(`/labs/${labId}/revisions/${revisionId}`)
    await hydrated(page)
    const cells = page.locator('[data-test="revision-forecast"] td.num')
    await cells.first().waitFor()
    // The line boxes of each cell's text (a cell is as tall as its row, so its own height says nothing).
    const lines = await cells.evaluateAll(tds =>
      tds.map(td => {
        const range = document.createRange()
        range.selectNodeContents(td)
        return {
          text: td.textContent!.trim(),
          lines: new Set([...range.getClientRects()].filter(r => r.width > 0).map(r => Math.round(r.top))).size,
        }
      }),
    )
    expect(lines.length).toBeGreaterThanOrEqual(2)
    for (const l of lines) expect(l.lines, `"${l.text}" on one line`).toBe(1)
    await page.context().close()
  })

  it('1024 px: the compare table keeps each inlet setting whole and inside its column', async () => {
    const { page, labId } = await demoPage('reviewer@quillmere.example', 1024)
    const listed = JSON.stringify(
      await (await page.request.get(`/api/labs/${labId}/designs?q=Cell%20encapsulation`)).json(),
    )
    const designId = /"id":"([^"]+)"/.exec(listed)![1]
    const revisions = JSON.stringify(
      await (await page.request.get(`/api/labs/${labId}/designs/${designId}/revisions`)).json(),
    )
    const ids = [...revisions.matchAll(/"id":"([0-9a-f-]{36})"/g)].map(m => m[1]!)
    expect(ids.length).toBeGreaterThanOrEqual(2)
    await page.goto(`/labs/${labId}/revisions/${ids.at(-1)}/compare/${ids.at(-2)}`)
    await hydrated(page)
    const cells = page.locator('[data-test="compare-parameters"] td.num')
    await cells.first().waitFor()
    // Each cell's text as the lines it is laid out in (character by character), and how far it runs past the cell.
    const seen = await cells.evaluateAll(tds =>
      tds.map(td => {
        const lines: string[] = []
        let top: number | null = null
        let over = 0
        const walker = document.createTreeWalker(td, NodeFilter.SHOW_TEXT)
        for (let node = walker.nextNode(); node; node = walker.nextNode()) {
          for (let i = 0; i < node.textContent!.length; i++) {
            const r = document.createRange()
            r.setStart(node, i)
            r.setEnd(node, i + 1)
            const box = r.getBoundingClientRect()
            if (box.width === 0 && box.height === 0) continue
            over = Math.max(over, box.right - td.getBoundingClientRect().right)
            if (top === null || Math.abs(box.top - top) > 2) {
              lines.push('')
              top = box.top
            }
            lines[lines.length - 1] = `${lines.at(-1) ?? ''}${node.textContent!.charAt(i)}`
          }
        }
        return { text: td.textContent!, lines: lines.map(l => l.trim()), over }
      }),
    )
    const inlets = seen.filter(c => /µL\/min/.test(c.text))
    expect(inlets.length).toBeGreaterThanOrEqual(2)
    for (const c of inlets) {
      expect(c.over, `"${c.text}" inside its column`).toBeLessThanOrEqual(1)
      for (const [k, line] of c.lines.entries()) {
        const next = c.lines[k + 1]
        if (next === undefined) continue
        expect(
          `${line} | ${next}`,
          'no line ends on a number whose unit starts the next, or inside "oil-in"',
        ).not.toMatch(/(\d \| [µn]L)|(- \| )/)
      }
    }
    await page.context().close()
  })

  it('the demo fabrication order tells its story up to now, never in the future', async () => {
    const { page, labId } = await demoPage('fabricator@brackenfold.example', 1024)
    const orders = (await (await page.request.get(`/api/labs/${labId}/orders`)).json()) as
      { orders: Array<{ id: string }> } | Array<{ id: string }>
    const list = Array.isArray(orders) ? orders : orders.orders
    expect(list.length).toBeGreaterThan(0)
    const order = await (await page.request.get(`/api/labs/${labId}/orders/${list[0]!.id}`)).json()
    const dates = JSON.stringify(order)
      .match(/"\d{4}-\d{2}-\d{2}T[^"]+"/g)!
      .map(d => new Date(JSON.parse(d)).getTime())
    expect(dates.length).toBeGreaterThan(2)
    expect(Math.max(...dates)).toBeLessThanOrEqual(Date.now() + 5_000)
    await page.context().close()
  })
})
