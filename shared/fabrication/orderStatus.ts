// A fabrication order's statuses, their words and the moves each may make — declared once, for the database enum,
// the payload schema, the server's guarded update and the fabricator's choices in the UI. Delivered is final.
export const ORDER_STATUSES = ['received', 'in-fabrication', 'shipped', 'delivered', 'on-hold'] as const
export type OrderStatus = (typeof ORDER_STATUSES)[number]

export const ORDER_STATUS_LABELS: Record<OrderStatus, string> = {
  received: 'Received by the fab, not started',
  'in-fabrication': 'Being made',
  shipped: 'Shipped',
  delivered: 'Delivered to the lab',
  'on-hold': 'On hold',
}

/** What a button that moves an order to the status says. */
export const ORDER_MOVE_LABELS: Record<OrderStatus, string> = {
  received: 'Back to the queue',
  'in-fabrication': 'Start making',
  shipped: 'Mark as shipped',
  delivered: 'Confirm delivery',
  'on-hold': 'Put on hold',
}

export const ORDER_NEXT: Record<OrderStatus, readonly OrderStatus[]> = {
  received: ['in-fabrication', 'on-hold'],
  'in-fabrication': ['shipped', 'on-hold'],
  shipped: ['delivered'],
  delivered: [],
  'on-hold': ['received', 'in-fabrication'],
}

/** The statuses an order may be in for a move to `to` to be allowed. */
export const orderFrom = (to: OrderStatus): OrderStatus[] =>
  ORDER_STATUSES.filter(from => ORDER_NEXT[from].includes(to))

/** How a fabrication status of the first release flow (before orders) reads as an order status. */
export const ORDER_STATUS_OF_OLD_FAB_STATUS = {
  released: 'received',
  'in-fabrication': 'in-fabrication',
  shipped: 'shipped',
  received: 'delivered',
  'on-hold': 'on-hold',
} as const satisfies Record<string, OrderStatus>

export const SUBSTRATES = ['glass', 'pdms-on-glass', 'pdms-on-pdms', 'thermoplastic'] as const
export const SUBSTRATE_LABELS: Record<(typeof SUBSTRATES)[number], string> = {
  glass: 'Glass, thermally bonded',
  'pdms-on-glass': 'PDMS on glass, plasma bonded',
  'pdms-on-pdms': 'PDMS on PDMS, plasma bonded',
  thermoplastic: 'Thermoplastic, solvent or thermal bond',
}
export const MASK_POLARITIES = ['positive', 'negative'] as const
export const MASK_POLARITY_LABELS: Record<(typeof MASK_POLARITIES)[number], string> = {
  positive: 'Channels clear (light through the channels)',
  negative: 'Channels dark (light around the channels)',
}
export const MASK_MEDIA = ['film', 'chrome'] as const
export const MASK_MEDIUM_LABELS: Record<(typeof MASK_MEDIA)[number], string> = {
  film: 'Printed film',
  chrome: 'Chrome on glass',
}
