// A released revision's fabrication status and the moves it may make — declared once, for the server's guarded
// update and the fabricator's choice in the UI. Received is final.
export const FAB_STATUSES = ['released', 'in-fabrication', 'shipped', 'received', 'on-hold'] as const
export type FabStatus = (typeof FAB_STATUSES)[number]

export const FAB_STATUS_LABELS: Record<FabStatus, string> = {
  'released': 'Released, not started',
  'in-fabrication': 'In fabrication',
  'shipped': 'Shipped',
  'received': 'Received by the lab',
  'on-hold': 'On hold',
}

export const FAB_NEXT: Record<FabStatus, readonly FabStatus[]> = {
  'released': ['in-fabrication', 'on-hold'],
  'in-fabrication': ['shipped', 'on-hold'],
  'shipped': ['received'],
  'received': [],
  'on-hold': ['released', 'in-fabrication'],
}

/** The statuses an order may be in for a move to `to` to be allowed. */
export const fabFrom = (to: FabStatus): FabStatus[] => FAB_STATUSES.filter(from => FAB_NEXT[from].includes(to))
