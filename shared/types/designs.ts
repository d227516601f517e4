import type { OrderStatus } from '../fabrication/orderStatus'
import type { Role } from '../utils/roles'
import type { InletSummary, JunctionSummary } from '../physics/document/summary'

import type { RevisionStatus } from '../utils/revisionStatus'

export type { JunctionSummary } from '../physics/document/summary'

/** An inlet as stored: the core's InletSummary; summaries stored before mode and flow were kept lack them. */
export type StoredInletSummary = Pick<InletSummary, 'portId' | 'pressureMbar'> &
  Partial<Pick<InletSummary, 'mode' | 'flowUlPerMin'>>
export interface RevisionSummary {
  junctionKinds: string[]
  counts: { channels: number; components: number; ports: number; layers: number }
  operatingPoint: string | null
  junctions: JunctionSummary[]
  inlets: StoredInletSummary[]
  forecastError: string | null
  findings: { errors: number; warnings: number; infos: number }
  processId: string
  /** The library values this revision was forecast and checked with (absent on summaries stored before it was kept). */
  library?: LibrarySnapshot
  /**
   * Set while a large chip's forecast and rule check are still being computed by the background job: `junctions`,
   * `inlets` and `findings` are then empty, not zero results. Absent on every finished summary.
   */
  pending?: true
}

/** A liquid as the forecast used it: SI-free display units and where the values came from. */
export interface LiquidSnapshot {
  id: string | null
  name: string
  origin: 'built-in' | 'lab' | 'given'
  viscosityMPaS: number
  densityKgPerM3: number
  source: string
}
/** What a revision was forecast with, so a later library edit never changes its numbers. */
export interface LibrarySnapshot {
  operatingPoint: string | null
  temperatureC: number | null
  continuous: LiquidSnapshot | null
  dispersed: LiquidSnapshot | null
  surfactant: string | null
  interfacialTension: { mNPerM: number; origin: 'built-in' | 'lab' | 'given'; source: string } | null
  /** `source`: the lab's source for its own process (kept since the fab sheets print it). */
  process: {
    id: string
    name: string
    origin: 'built-in' | 'lab'
    values: Record<string, number | string>
    source?: string
  }
}

export interface DesignOriginView {
  revisionId: string
  designId: string
  designName: string
  revisionNumber: number
  authorName: string
  labName: string
}

export interface DesignRow {
  id: string
  name: string
  description: string
  processId: string
  junctionKinds: string[]
  latestRevisionId: string | null
  latestNumber: number | null
  status: RevisionStatus | null
  updatedAt: string
  authorName: string
  archived: boolean
  origin: DesignOriginView | null
}

export interface RevisionRow {
  id: string
  designId: string
  number: number
  parentId: string | null
  message: string
  authorName: string
  createdAt: string
  status: RevisionStatus
  statusChangedAt: string
  summary: RevisionSummary
}

export interface RevisionDetail extends RevisionRow {
  designName: string
  labId: string
  document: unknown
  latestRevisionId: string | null
}

export interface ActivityEntry {
  id: number
  action: string
  actorName: string
  at: string
  revisionNumber: number | null
  detail: Record<string, unknown>
}
export interface ReviewerOption {
  userId: string
  name: string
  role: Role
}

export interface CommentView {
  id: string
  authorName: string
  body: string
  createdAt: string
}
export interface ThreadView {
  id: string
  anchor: { x: number; y: number; elementId?: string }
  createdBy: string
  createdAt: string
  resolvedAt: string | null
  resolvedBy: string | null
  comments: CommentView[]
}
export interface VerdictView {
  reviewerId: string
  reviewerName: string
  verdict: 'approve' | 'request-changes'
  note: string
  at: string
}
export interface ReviewState {
  status: RevisionStatus
  statusChangedAt: string
  statusChangedBy: string | null
  requests: Array<{ reviewerId: string; name: string }>
  verdicts: VerdictView[]
  threads: ThreadView[]
  reviewers: ReviewerOption[]
  release: {
    releasedAt: string
    releasedBy: string
    note: string
    orderId: string
    orderNumber: number
    orderStatus: OrderStatus
    orderStatusAt: string
  } | null
}

/** A mask DXF made in the background (`POST …/dxf-exports`): where it is, and the file once it is ready. */
export type MaskExport =
  | { exportId: string; status: 'queued' | 'making' }
  | { exportId: string; status: 'ready'; filename: string; bytes: number; fileUrl: string }
  | { exportId: string; status: 'failed'; error: string }
