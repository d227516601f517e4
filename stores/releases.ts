import type { OrderStatus } from '~~/shared/fabrication/orderStatus'
import { defineStore } from 'pinia'

export interface ReleasedRow {
  revisionId: string
  number: number
  designName: string
  releasedAt: string
  orderId: string
  orderNumber: number
  orderStatus: OrderStatus
  orderStatusAt: string
}

export const useReleasesStore = defineStore('releases', () => {
  const rows = ref<ReleasedRow[]>([])
  const { busy, problem, run } = useApiCall()
  async function load(labId: string) {
    await run(async () => {
      rows.value = await useRequestFetch()<ReleasedRow[]>(`/api/labs/${labId}/releases`)
    })
  }
  return { rows, busy, problem, load }
})
