// Issue 16 item 4: the revision page and the compare table read with the elements' own names ("Operating point
// “Beads at 4:1 oil”", "layer “Channels”"), never an operating point id like "op-1" or the id of an element that
// has a name. The API keeps its ids; only the screen changes.
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hydrated, launch, newPage, signInAs } from '../support/browser'
import { ApiClient } from '../support/api'
import { makeLab, TEST_PASSWORD } from '../support/factory'
import { demoDesigns } from '../../server/db/demo-designs'

interface Made {
  name: string
  revisionIds: string[]
  namedIds: string[]
}
let browser: Browser
let page: Page
let labId = ''
const made: Made[] = []

/** Ids of the elements that have a name of their own (operating points, layers, named channels). */
function namedIds(doc: any): string[] {
  return [...doc.operatingPoints, ...doc.layers, ...doc.channels.filter((c: any) => c.name)]
    .filter((e: any) => e.name && e.name !== e.id)
    .map((e: any) => e.id)
}

beforeAll(async () => {
  browser = await launch()
  const { lab, people } = await makeLab(['designer', 'reviewer'])
  labId = lab.id
  const designer = await new ApiClient().signIn(people.find(p => p.role === 'designer')!.email, TEST_PASSWORD)
  for (const d of demoDesigns()) {
    const [first, ...rest] = d.revisions
    const created = await designer.post(`/api/labs/${lab.id}/designs`, { name: d.name, document: first!.document })
    expect(created.status).toBe(201)
    const ids = [created.json.revisionId as string]
    for (const r of rest) {
      const saved = await designer.post(`/api/labs/${lab.id}/designs/${created.json.designId}/revisions`, {
        parentId: ids.at(-1),
        message: r.message,
        document: r.document,
      })
      expect(saved.status).toBe(201)
      ids.push(saved.json.revisionId)
    }
    made.push({
      name: d.name,
      revisionIds: ids,
      namedIds: [...new Set(d.revisions.flatMap(r => namedIds(r.document)))],
    })
  }
  page = await newPage(browser)
  await signInAs(page, people.find(p => p.role === 'reviewer')!.email, TEST_PASSWORD)
  await page.waitForURL(/\/labs\//)
}, 180_000)
afterAll(async () => {
  await browser?.close()
})

const raw = (text: string, ids: string[]) => [
  ...(text.match(/\bop-\d+\b/g) ?? []),
  ...ids.filter(id => new RegExp(`["“]${id.replace(/[-[\]]/g, '\\$&')}["”]`).test(text)),
]

describe('names, not ids, on the revision page', () => {
  it("every revision of the demo designs lists its findings with the elements' names", async () => {
    let findings = 0
    for (const d of made) {
      for (const id of d.revisionIds) {
        await page.goto(`/labs/${labId}/revisions/${id}`)
        await hydrated(page)
        await page.waitForSelector('[data-test="findings-panel"]')
        const text = (await page.locator('main').textContent()) ?? ''
        expect(raw(text, d.namedIds), `${d.name}, revision ${id}`).toEqual([])
        findings += await page.locator('[data-test="findings-panel"] li').count()
      }
    }
    // The demo chips do have findings (wetting, solvent, notes), so the names were really read.
    expect(findings).toBeGreaterThan(0)
    const bead = made.find(d => d.name === 'Hydrogel bead flow-focuser')!
    await page.goto(`/labs/${labId}/revisions/${bead.revisionIds[0]}`)
    await hydrated(page)
    await expect
      .poll(() => page.locator('[data-test="findings-panel"]').textContent())
      .toContain('Operating point “Beads at 4:1 oil”')
  })

  it('the compare table names the operating point by its name', async () => {
    const t = made.find(d => d.name === 'Cell encapsulation T-junction')!
    await page.goto(`/labs/${labId}/revisions/${t.revisionIds[1]}/compare/${t.revisionIds[0]}`)
    await hydrated(page)
    const table = page.locator('[data-test="compare-parameters"]')
    await expect.poll(() => table.textContent()).toMatch(/Operating point “[^”]+”/)
    expect(raw((await page.locator('main').textContent()) ?? '', t.namedIds)).toEqual([])
  })
})
