// What the orders API answers.
import type { OrderStatus } from '../fabrication/orderStatus'
import type { OrderDetails } from '../schemas/orders'

export interface OrderRow extends OrderDetails {
  id: string
  number: number
  status: OrderStatus
  statusAt: string
  holdReason: string | null
  trackingNumber: string | null
  revisionId: string
  revisionNumber: number
  designName: string
  createdBy: string
  createdAt: string
  messages: number
}
export interface OrderMessageView {
  id: string
  authorName: string
  body: string
  status: OrderStatus | null
  createdAt: string
}
export interface OrderLink {
  label: string
  href: string
}
export interface OrderDetailView extends OrderRow {
  thread: OrderMessageView[]
  /** The DXF per layer, the whole mask and the fab sheet (printable and PDF). */
  files: OrderLink[]
  layers: Array<{ id: string; name: string; depthUm: number }>
}
