// Fabrication orders: what a release asks the fab to make, moved through its statuses by the fab with a thread
// between lab and fab. Each change queues its e-mail in the change's own transaction.
import { and, asc, count, desc, eq, inArray, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { createError } from 'h3'
import { designs, fabOrderMessages, fabOrders, memberships, revisions, users } from '../db/schema'
import { useDb, type Tx } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { appOrigin } from '../utils/origin'
import { logActivity } from './activity'
import { notFound } from './designGuards'
import { conflict } from './locks'
import { queueMailTo } from './mail'
import { orderMessageMail, orderMovedMail } from './mailTemplates'
import { ORDER_NEXT, ORDER_STATUS_LABELS, orderFrom } from '#shared/fabrication/orderStatus'
import type { OrderDetails, OrderMove } from '#shared/schemas/orders'
import type { OrderDetailView, OrderRow } from '#shared/types/orders'

/** Called by the release, inside its transaction, after the revision row lock. */
export async function createOrder(
  tx: Tx,
  caller: LabCaller,
  p: { revisionId: string; releaseId: string; details: OrderDetails },
) {
  // Numbers count per lab; the advisory lock (always taken last) serialises two releases in one lab.
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`fab_orders:${caller.lab.labId}`}))`)
  const [{ next }] = (await tx
    .select({ next: sql<number>`coalesce(max(${fabOrders.number}), 0) + 1` })
    .from(fabOrders)
    .where(eq(fabOrders.labId, caller.lab.labId))) as [{ next: number }]
  const [order] = await tx
    .insert(fabOrders)
    .values({
      labId: caller.lab.labId,
      revisionId: p.revisionId,
      releaseId: p.releaseId,
      number: Number(next),
      createdBy: caller.userId,
      ...p.details,
    })
    .returning({ id: fabOrders.id, number: fabOrders.number })
  return order!
}

const creator = alias(users, 'order_creator')
const rowColumns = {
  id: fabOrders.id,
  number: fabOrders.number,
  status: fabOrders.status,
  statusAt: fabOrders.statusAt,
  holdReason: fabOrders.holdReason,
  trackingNumber: fabOrders.trackingNumber,
  quantity: fabOrders.quantity,
  substrate: fabOrders.substrate,
  maskPolarity: fabOrders.maskPolarity,
  maskMedium: fabOrders.maskMedium,
  dueDate: fabOrders.dueDate,
  poNumber: fabOrders.poNumber,
  notes: fabOrders.notes,
  revisionId: fabOrders.revisionId,
  revisionNumber: revisions.number,
  designName: designs.name,
  createdBy: creator.name,
  createdAt: fabOrders.createdAt,
}
type RawRow = Omit<OrderRow, 'statusAt' | 'createdAt' | 'messages'> & { statusAt: Date; createdAt: Date }
const shown = (r: RawRow, messages: number): OrderRow => ({
  ...r,
  statusAt: r.statusAt.toISOString(),
  createdAt: r.createdAt.toISOString(),
  messages,
})

function ordersQuery() {
  return useDb()
    .select(rowColumns)
    .from(fabOrders)
    .innerJoin(revisions, eq(revisions.id, fabOrders.revisionId))
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .innerJoin(creator, eq(creator.id, fabOrders.createdBy))
}

/** The lab's orders, open ones first (the fab's queue), newest first within each status. */
export async function listOrders(caller: LabCaller): Promise<OrderRow[]> {
  const rows = await ordersQuery().where(eq(fabOrders.labId, caller.lab.labId)).orderBy(desc(fabOrders.createdAt))
  if (!rows.length) return []
  const counts = await useDb()
    .select({ orderId: fabOrderMessages.orderId, n: count() })
    .from(fabOrderMessages)
    .where(
      inArray(
        fabOrderMessages.orderId,
        rows.map(r => r.id),
      ),
    )
    .groupBy(fabOrderMessages.orderId)
  const byOrder = new Map(counts.map(c => [c.orderId, Number(c.n)]))
  return rows.map(r => shown(r, byOrder.get(r.id) ?? 0))
}

export async function getOrder(caller: LabCaller, orderId: string): Promise<OrderDetailView> {
  const db = useDb()
  const [row] = await ordersQuery().where(and(eq(fabOrders.id, orderId), eq(fabOrders.labId, caller.lab.labId)))
  if (!row) throw notFound('order')
  const thread = await db
    .select({
      id: fabOrderMessages.id,
      authorName: users.name,
      body: fabOrderMessages.body,
      status: fabOrderMessages.status,
      createdAt: fabOrderMessages.createdAt,
    })
    .from(fabOrderMessages)
    .innerJoin(users, eq(users.id, fabOrderMessages.authorId))
    .where(eq(fabOrderMessages.orderId, orderId))
    .orderBy(asc(fabOrderMessages.createdAt), asc(fabOrderMessages.id))
  const [doc] = await db
    .select({ layers: sql<Array<{ id: string; name: string; depth: number }>>`${revisions.document}->'layers'` })
    .from(revisions)
    .where(eq(revisions.id, row.revisionId))
  const layers = (doc?.layers ?? []).map(l => ({ id: l.id, name: l.name, depthUm: l.depth }))
  const rev = `/api/labs/${caller.lab.labId}/revisions/${row.revisionId}`
  const files = [
    { label: 'Mask, every layer (DXF)', href: `${rev}/dxf` },
    ...layers.map(l => ({
      label: `Layer "${l.name}", ${l.depthUm} µm deep (DXF)`,
      href: `${rev}/dxf?layers=${encodeURIComponent(l.id)}`,
    })),
    { label: 'Fab sheet (PDF)', href: `${rev}/fab-sheet.pdf` },
    { label: 'Fab sheet (printable page)', href: `/labs/${caller.lab.labId}/revisions/${row.revisionId}/fab-sheet` },
  ]
  return {
    ...shown(row, thread.length),
    thread: thread.map(m => ({ ...m, createdAt: m.createdAt.toISOString() })),
    files,
    layers,
  }
}

/** A guarded move: the update names the statuses it may come from, so of two racing moves only one applies. */
export async function moveOrder(caller: LabCaller, orderId: string, move: OrderMove & { note: string }) {
  return useDb().transaction(async tx => {
    const [row] = await tx
      .update(fabOrders)
      .set({
        status: move.status,
        statusAt: new Date(),
        holdReason: move.status === 'on-hold' ? move.note : null,
        ...(move.status === 'shipped' ? { trackingNumber: move.trackingNumber } : {}),
      })
      .where(
        and(
          eq(fabOrders.id, orderId),
          eq(fabOrders.labId, caller.lab.labId),
          inArray(fabOrders.status, orderFrom(move.status)),
        ),
      )
      .returning({ id: fabOrders.id })
    if (!row) {
      const [current] = await tx
        .select({ status: fabOrders.status })
        .from(fabOrders)
        .where(and(eq(fabOrders.id, orderId), eq(fabOrders.labId, caller.lab.labId)))
      if (!current) throw notFound('order')
      const next = ORDER_NEXT[current.status].map(s => `"${ORDER_STATUS_LABELS[s]}"`)
      throw conflict(
        `The order is "${ORDER_STATUS_LABELS[current.status]}": it cannot move to "${ORDER_STATUS_LABELS[move.status]}"${next.length ? ` (it can move to ${next.join(' or ')})` : ' (delivered is final)'}`,
        { status: current.status },
      )
    }
    const body =
      move.status === 'shipped'
        ? [`Tracking number: ${move.trackingNumber}`, move.note].filter(Boolean).join('\n')
        : move.note
    await tx
      .insert(fabOrderMessages)
      .values({ orderId, labId: caller.lab.labId, authorId: caller.userId, body, status: move.status })
    const o = await orderContext(tx, caller, orderId)
    await logActivity(tx, {
      labId: caller.lab.labId,
      designId: o.designId,
      revisionId: o.revisionId,
      actorId: caller.userId,
      action: 'order.status',
      detail: { order: o.orderNumber, status: move.status, note: move.note },
    })
    await queueMailTo(tx, o.recipients, {
      labId: caller.lab.labId,
      kind: 'order',
      ...orderMovedMail({
        ...o,
        statusLabel: ORDER_STATUS_LABELS[move.status],
        note: move.note,
        trackingNumber: move.status === 'shipped' ? (move.trackingNumber ?? null) : null,
      }),
    })
    return { status: move.status }
  })
}

export async function postOrderMessage(caller: LabCaller, orderId: string, body: string) {
  return useDb().transaction(async tx => {
    const [order] = await tx
      .select({ id: fabOrders.id })
      .from(fabOrders)
      .where(and(eq(fabOrders.id, orderId), eq(fabOrders.labId, caller.lab.labId)))
    if (!order) throw notFound('order')
    const [message] = await tx
      .insert(fabOrderMessages)
      .values({ orderId, labId: caller.lab.labId, authorId: caller.userId, body })
      .returning({ id: fabOrderMessages.id })
    const o = await orderContext(tx, caller, orderId)
    const excerpt = body.length > 400 ? `${body.slice(0, 400)}…` : body
    await queueMailTo(tx, o.recipients, {
      labId: caller.lab.labId,
      kind: 'order',
      ...orderMessageMail({ ...o, excerpt }),
    })
    return { messageId: message!.id }
  })
}

/** Who hears about an order: the lab people on it (who released it, the design's creator, the revision's author) and the lab's fabricators, never the one acting. */
async function orderContext(tx: Tx, caller: LabCaller, orderId: string) {
  const [o] = await tx
    .select({
      orderNumber: fabOrders.number,
      createdBy: fabOrders.createdBy,
      revisionId: fabOrders.revisionId,
      revisionNumber: revisions.number,
      authorId: revisions.authorId,
      designId: designs.id,
      designName: designs.name,
      designCreator: designs.createdBy,
    })
    .from(fabOrders)
    .innerJoin(revisions, eq(revisions.id, fabOrders.revisionId))
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .where(eq(fabOrders.id, orderId))
  if (!o) throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such order in this lab' })
  const fabricators = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.labId, caller.lab.labId), eq(memberships.role, 'fabricator')))
  const ids = [...new Set([o.createdBy, o.designCreator, o.authorId, ...fabricators.map(f => f.userId)])].filter(
    id => id !== caller.userId,
  )
  // Only people still in the lab hear about it.
  const inLab = ids.length
    ? await tx
        .select({ email: users.email })
        .from(users)
        .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.labId, caller.lab.labId)))
        .where(inArray(users.id, ids))
    : []
  const [me] = await tx.select({ name: users.name }).from(users).where(eq(users.id, caller.userId))
  return {
    ...o,
    recipients: inLab.map(r => r.email),
    actorName: me?.name ?? 'Someone',
    link: `${appOrigin()}/labs/${caller.lab.labId}/orders/${orderId}`,
  }
}
