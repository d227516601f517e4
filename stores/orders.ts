import { defineStore } from 'pinia'
import type { OrderMove } from '~~/shared/schemas/orders'
import type { OrderDetailView, OrderRow } from '~~/shared/types/orders'

/** The lab's fabrication orders and the one open order with its thread. */
export const useOrdersStore = defineStore('orders', () => {
  const rows = ref<OrderRow[]>([])
  const order = ref<OrderDetailView | null>(null)
  const { busy, problem, run } = useApiCall()

  async function load(labId: string) {
    await run(async () => {
      rows.value = await useRequestFetch()<OrderRow[]>(`/api/labs/${labId}/orders`)
    })
  }
  async function open(labId: string, orderId: string) {
    await run(async () => {
      order.value = await useRequestFetch()<OrderDetailView>(`/api/labs/${labId}/orders/${orderId}`)
    })
  }
  async function act(labId: string, orderId: string, path: string, body: Record<string, unknown>) {
    const url: string = `/api/labs/${labId}/orders/${orderId}/${path}`
    const done = await run(() => $fetch<unknown>(url, { method: 'POST', body }))
    if (done !== undefined) await open(labId, orderId)
    return done !== undefined
  }
  return {
    rows,
    order,
    busy,
    problem,
    load,
    open,
    move: (labId: string, orderId: string, move: OrderMove) => act(labId, orderId, 'status', move),
    write: (labId: string, orderId: string, body: string) => act(labId, orderId, 'messages', { body }),
  }
})
