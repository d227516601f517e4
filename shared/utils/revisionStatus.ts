// A revision's review statuses and their words — declared once, for the database enum, the list filter, the badge
// and the review panel. Released is final (a released revision is what the fab makes).
export const REVISION_STATUSES = ['draft', 'in-review', 'changes-requested', 'approved', 'released'] as const
export type RevisionStatus = (typeof REVISION_STATUSES)[number]

export const REVISION_STATUS_LABELS: Record<RevisionStatus, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  'changes-requested': 'Changes requested',
  approved: 'Approved',
  released: 'Released',
}

/** Statuses in which a reviewer may still give a verdict (everything under review, not a draft, not released). */
export const VERDICT_STATUSES: readonly RevisionStatus[] = ['in-review', 'changes-requested', 'approved']
