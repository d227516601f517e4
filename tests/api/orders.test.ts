// Fabrication orders over real HTTP and PostgreSQL: the order a release creates, the fab's moves with their
// guards, the thread between lab and fab, the e-mail on each change, and the migration of releases made before orders.
import { readFileSync } from 'node:fs'
import { describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import { labWithDesign } from '../support/designs'
import { releasedOrder } from '../support/orders'
import { waitForMail } from '../support/mail'

async function sql<T extends pg.QueryResultRow>(text: string, values: unknown[] = []): Promise<T[]> {
  const client = new pg.Client({ connectionString: inject('databaseUrl') })
  await client.connect()
  try {
    return (await client.query<T>(text, values)).rows
  } finally {
    await client.end()
  }
}

describe('fabrication orders (real server, real PostgreSQL)', () => {
  it('a release creates the order with what the fab needs; the fab sees it with a DXF per layer and the fab sheet', async () => {
    const c = await labWithDesign()
    const details = {
      quantity: 6,
      substrate: 'glass',
      maskPolarity: 'negative',
      maskMedium: 'chrome',
      dueDate: '2027-03-15',
      poNumber: 'PO-2027-014',
      notes: 'Punch ports at 0.75 mm',
    }
    const { orderId, orderNumber, revisionId } = await releasedOrder(c, details)
    expect(orderNumber).toBe(1)
    const list = await c.as.fabricator.get(`/api/labs/${c.lab.id}/orders`)
    expect(list.status).toBe(200)
    expect(list.json).toHaveLength(1)
    expect(list.json[0]).toMatchObject({ id: orderId, status: 'received', revisionId, ...details })
    const order = (await c.as.fabricator.get(`/api/labs/${c.lab.id}/orders/${orderId}`)).json
    expect(order.layers.length).toBeGreaterThan(0)
    const perLayer = order.files.filter((f: { label: string }) => f.label.startsWith('Layer'))
    expect(perLayer).toHaveLength(order.layers.length)
    const dxf = await c.as.fabricator.get(perLayer[0].href)
    expect(dxf.status).toBe(200)
    expect(String(dxf.json)).toContain('$INSUNITS')
    expect(order.files.map((f: { href: string }) => f.href)).toContain(
      `/api/labs/${c.lab.id}/revisions/${revisionId}/fab-sheet.pdf`,
    )
    // A second release in the lab is order 2.
    expect((await releasedOrder(c)).orderNumber).toBe(2)
  })

  it('refuses a bad order with the field, the fix and the limit', async () => {
    const c = await labWithDesign()
    const base = `/api/labs/${c.lab.id}/revisions/${c.revisionId}`
    const bad = await c.as.admin.post(`${base}/release`, {
      order: { quantity: 0, dueDate: '2027-02-30x', substrate: 'paper' },
    })
    expect(bad.status).toBe(400)
    const issues = bad.json.data.issues.map((i: { path: string; message: string }) => `${i.path}: ${i.message}`)
    expect(issues).toEqual(
      expect.arrayContaining([
        'order.quantity: Order at least 1 chip',
        'order.dueDate: Due date must be a date like 2027-01-31',
        expect.stringMatching(/^order\.substrate: Substrate must be one of/),
      ]),
    )
  })

  it('the fab moves the order with a note and a tracking number; each change writes the thread and mails the other side', async () => {
    const c = await labWithDesign()
    const { orderId } = await releasedOrder(c)
    const path = `/api/labs/${c.lab.id}/orders/${orderId}`
    expect((await c.as.fabricator.post(`${path}/status`, { status: 'on-hold' })).json.data.issues[0]).toMatchObject({
      path: 'note',
      message: 'Say why the order is on hold',
    })
    expect(
      (await c.as.fabricator.post(`${path}/status`, { status: 'on-hold', note: 'Waiting for resist' })).status,
    ).toBe(200)
    expect((await c.as.fabricator.get(path)).json).toMatchObject({
      status: 'on-hold',
      holdReason: 'Waiting for resist',
    })
    expect(
      (await c.as.fabricator.post(`${path}/status`, { status: 'in-fabrication', note: 'Resist arrived' })).status,
    ).toBe(200)
    const noTracking = await c.as.fabricator.post(`${path}/status`, { status: 'shipped' })
    expect(noTracking.status).toBe(400)
    expect(noTracking.json.data.issues[0]).toMatchObject({
      path: 'trackingNumber',
      message: 'Give the tracking number of the shipment',
    })
    expect(
      (await c.as.fabricator.post(`${path}/status`, { status: 'shipped', trackingNumber: 'ZX-4471-09' })).status,
    ).toBe(200)
    expect(
      (await c.as.designer.post(`${path}/messages`, { body: 'Thanks, we will measure the depths on arrival.' })).status,
    ).toBe(201)
    const order = (await c.as.admin.get(path)).json
    expect(order).toMatchObject({ status: 'shipped', trackingNumber: 'ZX-4471-09', holdReason: null })
    expect(order.thread.map((m: { status: string | null; body: string }) => [m.status, m.body])).toEqual([
      ['on-hold', 'Waiting for resist'],
      ['in-fabrication', 'Resist arrived'],
      ['shipped', 'Tracking number: ZX-4471-09'],
      [null, 'Thanks, we will measure the depths on arrival.'],
    ])
    // E-mail through the mail.send job: the admin (who released) hears of each move, the fabricator of the message.
    const adminEmail = (
      await sql<{ email: string }>(
        'select u.email from users u join memberships m on m.user_id = u.id where m.lab_id = $1 and m.role = $2',
        [c.lab.id, 'admin'],
      )
    )[0]!.email
    const shipped = await waitForMail(adminEmail, { index: 2, timeoutMs: 20_000 })
    expect(shipped.subject).toMatch(/^Shipped: order 1/)
    expect(shipped.text).toContain('Tracking number: ZX-4471-09')
    const fabEmail = (
      await sql<{ email: string }>(
        'select u.email from users u join memberships m on m.user_id = u.id where m.lab_id = $1 and m.role = $2',
        [c.lab.id, 'fabricator'],
      )
    )[0]!.email
    const message = await waitForMail(fabEmail, { index: 1, timeoutMs: 20_000 })
    expect(message.subject).toMatch(/^New message on order 1/)
    expect(message.text).toContain('we will measure the depths')
    // Delivered is final; a lost move answers 409 in people's words.
    expect((await c.as.fabricator.post(`${path}/status`, { status: 'delivered' })).status).toBe(200)
    const again = await c.as.fabricator.post(`${path}/status`, { status: 'in-fabrication' })
    expect(again.status).toBe(409)
    expect(again.json.message).toBe(
      'The order is "Delivered to the lab": it cannot move to "Being made" (delivered is final)',
    )
  }, 60_000)

  it("another lab's order is 404 for every role, even with a valid id", async () => {
    const a = await labWithDesign()
    const b = await labWithDesign()
    const { orderId } = await releasedOrder(b)
    expect((await a.as.fabricator.get(`/api/labs/${a.lab.id}/orders/${orderId}`)).status).toBe(404)
    expect(
      (await a.as.fabricator.post(`/api/labs/${a.lab.id}/orders/${orderId}/status`, { status: 'in-fabrication' }))
        .status,
    ).toBe(404)
    expect((await a.as.admin.post(`/api/labs/${a.lab.id}/orders/${orderId}/messages`, { body: 'hello?' })).status).toBe(
      404,
    )
    expect((await a.as.fabricator.get(`/api/labs/${a.lab.id}/orders`)).json).toEqual([])
  })

  it('the migration turns each earlier release and its fabrication status into an order with its history', async () => {
    const c = await labWithDesign()
    await releasedOrder(c)
    // An old-style release: the row as the first release flow wrote it, with no order, "received by the lab".
    const rev = {
      id: (await c.as.designer.post(`/api/labs/${c.lab.id}/designs`, { name: 'Released before orders' })).json
        .revisionId as string,
    }
    await sql('update revisions set status = $2 where id = $1', [rev.id, 'released'])
    const admin = (
      await sql<{ user_id: string }>('select user_id from memberships where lab_id = $1 and role = $2', [
        c.lab.id,
        'admin',
      ])
    )[0]!.user_id
    // Migration 0014 dropped the old status columns; they come back (as text, nullable) only while 0011 is replayed.
    await sql(
      'alter table releases add column if not exists fab_status text, add column if not exists fab_status_at timestamptz',
    )
    try {
      await sql(
        `insert into releases (revision_id, lab_id, released_by, released_at, fab_status, fab_status_at, note) values ($1, $2, $3, now() - interval '1 day', 'received', now(), 'Two wafers')`,
        [rev!.id, c.lab.id, admin],
      )
      const migration = readFileSync('server/db/migrations/0011_fab-orders-from-releases.sql', 'utf8')
      for (const statement of migration.split('--> statement-breakpoint')) await sql(statement)
    } finally {
      await sql('alter table releases drop column if exists fab_status, drop column if exists fab_status_at')
    }
    const [order] = await sql<{ id: string; status: string; notes: string; number: number }>(
      'select id, status, notes, number from fab_orders where revision_id = $1',
      [rev!.id],
    )
    expect(order).toMatchObject({ status: 'delivered', notes: 'Two wafers' })
    expect(order!.number).toBe(2) // after the lab's existing order
    const history = await sql<{ status: string }>('select status from fab_order_messages where order_id = $1', [
      order!.id,
    ])
    expect(history.map(h => h.status)).toEqual(['delivered'])
  })
})
