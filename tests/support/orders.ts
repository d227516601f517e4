// A released revision with its fabrication order, made through the real API in a lab from labWithDesign().
import { fixtureDocument } from './factory'
import type { labWithDesign } from './designs'

type Ctx = Awaited<ReturnType<typeof labWithDesign>>

export async function releasedOrder(
  c: Ctx,
  order: Record<string, unknown> = {},
  document: unknown = fixtureDocument(),
) {
  const created = await c.as.designer.post(`/api/labs/${c.lab.id}/designs`, {
    name: `Released ${Math.random().toString(36).slice(2, 8)}`,
    document,
  })
  if (created.status !== 201) throw new Error(`create failed: ${created.status} ${JSON.stringify(created.json)}`)
  const revisionId = created.json.revisionId as string
  const base = `/api/labs/${c.lab.id}/revisions/${revisionId}`
  await c.as.designer.post(`${base}/review-requests`, { reviewerIds: [c.ids.reviewer] })
  await c.as.reviewer.post(`${base}/verdicts`, { verdict: 'approve' })
  const released = await c.as.admin.post(`${base}/release`, { note: 'go', order })
  if (released.status !== 200) throw new Error(`release failed: ${released.status} ${JSON.stringify(released.json)}`)
  return {
    revisionId,
    designId: created.json.designId as string,
    orderId: released.json.orderId as string,
    orderNumber: released.json.orderNumber as number,
    base,
  }
}
