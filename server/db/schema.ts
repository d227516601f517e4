// Dropwright's tables. Migrations are generated from this file by drizzle-kit (`npm run db:generate`)
// and committed with their snapshots in server/db/migrations; never hand-written.
import { sql } from 'drizzle-orm'
import {
  bigint,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  varchar,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core'
import { ROLES } from '../../shared/utils/roles'
import { REVISION_STATUSES } from '../../shared/utils/revisionStatus'
import { MASK_MEDIA, MASK_POLARITIES, ORDER_STATUSES, SUBSTRATES } from '../../shared/fabrication/orderStatus'

export const roleEnum = pgEnum('role', ROLES)
export const labKindEnum = pgEnum('lab_kind', ['research', 'fabrication'])

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow()

export const users = pgTable(
  'users',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: varchar('email', { length: 254 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    passwordHash: text('password_hash').notNull(),
    createdAt: createdAt(),
  },
  t => [uniqueIndex('users_email_lower_idx').on(sql`lower(${t.email})`)],
)

export const labs = pgTable('labs', {
  id: uuid('id').primaryKey().defaultRandom(),
  slug: varchar('slug', { length: 64 }).notNull().unique(),
  name: varchar('name', { length: 120 }).notNull(),
  kind: labKindEnum('kind').notNull().default('research'),
  createdAt: createdAt(),
})

export const memberships = pgTable(
  'memberships',
  {
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    role: roleEnum('role').notNull(),
    createdAt: createdAt(),
  },
  t => [primaryKey({ columns: [t.userId, t.labId] }), index('memberships_lab_idx').on(t.labId)],
)

/** Server-side sessions: the cookie holds a random token, the table only its SHA-256. */
export const sessions = pgTable(
  'sessions',
  {
    tokenHash: varchar('token_hash', { length: 64 }).primaryKey(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  },
  t => [index('sessions_user_idx').on(t.userId), index('sessions_expires_idx').on(t.expiresAt)],
)

/**
 * A browser that has signed in to an account before: the `dw_device` cookie holds a random token, this table its
 * SHA-256. Sign-in attempts from a known device are counted apart from everyone else's (server/services/signIn.ts).
 */
export const knownDevices = pgTable(
  'known_devices',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: varchar('token_hash', { length: 64 }).notNull().unique(),
    createdAt: createdAt(),
    lastUsedAt: timestamp('last_used_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  },
  t => [index('known_devices_user_idx').on(t.userId)],
)

/**
 * Sign-in attempts that count against a limit: every attempt reserves its row before the password is checked, and a
 * right password deletes it again, so the rows are the failures plus the attempts still being checked. Kept in the
 * database so throttling holds across server instances. `device_id` is set for attempts from a known device.
 */
export const signInFailures = pgTable(
  'sign_in_failures',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    email: varchar('email', { length: 254 }).notNull(),
    ip: varchar('ip', { length: 64 }).notNull(),
    deviceId: uuid('device_id').references(() => knownDevices.id, { onDelete: 'cascade' }),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  t => [
    index('sign_in_failures_email_idx').on(t.email, t.at),
    index('sign_in_failures_ip_idx').on(t.ip, t.at),
    index('sign_in_failures_device_idx').on(t.deviceId, t.at),
  ],
)

/** A password reset link: the e-mail carries a random token, this table its SHA-256; one use, short expiry. */
export const passwordResets = pgTable(
  'password_resets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: varchar('token_hash', { length: 64 }).notNull().unique(),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
  },
  t => [index('password_resets_user_idx').on(t.userId, t.createdAt)],
)

export const revisionStatusEnum = pgEnum('revision_status', REVISION_STATUSES)
export const verdictEnum = pgEnum('verdict', ['approve', 'request-changes'])

/** Where a duplicated design came from, as it read when it was duplicated (the origin may be in another lab). */
export interface DesignOrigin {
  revisionId: string
  designId: string
  designName: string
  revisionNumber: number
  authorName: string
  labName: string
}

export const designs = pgTable(
  'designs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 120 }).notNull(),
    description: text('description').notNull().default(''),
    processId: varchar('process_id', { length: 64 }).notNull().default('film-mask-soft-litho'),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    latestRevisionId: uuid('latest_revision_id').references((): AnyPgColumn => revisions.id),
    revisionCount: integer('revision_count').notNull().default(0),
    /** Junction kinds of the latest revision, kept here so the design list never reads revision summaries. */
    junctionKinds: text('junction_kinds')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    origin: jsonb('origin').$type<DesignOrigin>(),
  },
  t => [
    // The designs list (server/services/designs.ts): one index per sort order, ending in id for the tie-break, so a
    // page of a 10,000-design lab is read off the index in either direction.
    index('designs_lab_updated_idx').on(t.labId, t.updatedAt, t.id),
    index('designs_lab_name_idx').on(t.labId, t.name, t.id),
    index('designs_lab_created_idx').on(t.labId, t.createdAt, t.id),
    // The list's search (name ilike '%…%'): trigrams (pg_trgm, created by the same migration) find the matching
    // names without reading every design of the lab.
    index('designs_name_trgm_idx').using('gin', t.name.op('gin_trgm_ops')),
  ],
)

/** Immutable: a database trigger refuses any change to a revision's content and any delete. */
export const revisions = pgTable(
  'revisions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    designId: uuid('design_id')
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    parentId: uuid('parent_id').references((): AnyPgColumn => revisions.id),
    authorId: uuid('author_id')
      .notNull()
      .references(() => users.id),
    message: varchar('message', { length: 500 }).notNull(),
    document: jsonb('document').notNull(),
    summary: jsonb('summary').notNull(),
    status: revisionStatusEnum('status').notNull().default('draft'),
    statusChangedAt: timestamp('status_changed_at', { withTimezone: true }).notNull().defaultNow(),
    statusChangedBy: uuid('status_changed_by').references(() => users.id),
    createdAt: createdAt(),
  },
  t => [
    uniqueIndex('revisions_design_number_idx').on(t.designId, t.number),
    index('revisions_lab_status_idx').on(t.labId, t.status),
  ],
)

export const reviewRequests = pgTable(
  'review_requests',
  {
    revisionId: uuid('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    reviewerId: uuid('reviewer_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    requestedBy: uuid('requested_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  t => [primaryKey({ columns: [t.revisionId, t.reviewerId] })],
)

export const verdicts = pgTable(
  'verdicts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    revisionId: uuid('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    reviewerId: uuid('reviewer_id')
      .notNull()
      .references(() => users.id),
    verdict: verdictEnum('verdict').notNull(),
    note: text('note').notNull().default(''),
    createdAt: createdAt(),
  },
  t => [index('verdicts_revision_idx').on(t.revisionId, t.createdAt)],
)

/** A comment thread pinned to a point or an element of a revision's geometry (µm). */
export interface CommentAnchor {
  x: number
  y: number
  elementId?: string
}

export const commentThreads = pgTable(
  'comment_threads',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    revisionId: uuid('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    designId: uuid('design_id')
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    anchor: jsonb('anchor').$type<CommentAnchor>().notNull(),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    resolvedBy: uuid('resolved_by').references(() => users.id),
  },
  t => [index('comment_threads_revision_idx').on(t.revisionId)],
)

export const comments = pgTable(
  'comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    threadId: uuid('thread_id')
      .notNull()
      .references(() => commentThreads.id, { onDelete: 'cascade' }),
    authorId: uuid('author_id')
      .notNull()
      .references(() => users.id),
    body: text('body').notNull(),
    createdAt: createdAt(),
  },
  t => [index('comments_thread_idx').on(t.threadId, t.createdAt)],
)

export const releases = pgTable(
  'releases',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    revisionId: uuid('revision_id')
      .notNull()
      .unique()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    releasedBy: uuid('released_by')
      .notNull()
      .references(() => users.id),
    releasedAt: timestamp('released_at', { withTimezone: true }).notNull().defaultNow(),
    note: text('note').notNull().default(''),
  },
  t => [index('releases_lab_idx').on(t.labId)],
)

export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    email: varchar('email', { length: 254 }).notNull(),
    role: roleEnum('role').notNull(),
    tokenHash: varchar('token_hash', { length: 64 }).notNull().unique(),
    invitedBy: uuid('invited_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: uuid('accepted_by').references(() => users.id),
  },
  t => [index('invitations_lab_idx').on(t.labId)],
)

/** Outgoing e-mail, written in the request's transaction and sent by a background worker with retries. */
export const mailOutbox = pgTable(
  'mail_outbox',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id').references(() => labs.id, { onDelete: 'set null' }),
    kind: varchar('kind', { length: 40 }).notNull(),
    to: varchar('to', { length: 254 }).notNull(),
    subject: varchar('subject', { length: 300 }).notNull(),
    text: text('text').notNull(),
    html: text('html'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    lastError: text('last_error'),
    createdAt: createdAt(),
  },
  t => [index('mail_outbox_pending_idx').on(t.sentAt, t.nextAttemptAt)],
)

/** The audit trail: who did what, when, per design. */
export const activity = pgTable(
  'activity',
  {
    id: bigint('id', { mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    designId: uuid('design_id').references(() => designs.id, { onDelete: 'cascade' }),
    revisionId: uuid('revision_id').references(() => revisions.id, { onDelete: 'cascade' }),
    actorId: uuid('actor_id')
      .notNull()
      .references(() => users.id),
    action: varchar('action', { length: 40 }).notNull(),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  t => [index('activity_design_idx').on(t.designId, t.at), index('activity_lab_idx').on(t.labId, t.at)],
)

export type User = typeof users.$inferSelect
export type Lab = typeof labs.$inferSelect
export type Membership = typeof memberships.$inferSelect
export type Session = typeof sessions.$inferSelect
export type Design = typeof designs.$inferSelect
export type Revision = typeof revisions.$inferSelect
export type CommentThread = typeof commentThreads.$inferSelect
export type Comment = typeof comments.$inferSelect
export type Invitation = typeof invitations.$inferSelect
export type KnownDevice = typeof knownDevices.$inferSelect
export type PasswordReset = typeof passwordResets.$inferSelect
export type MailMessage = typeof mailOutbox.$inferSelect

// ── platform (issue 12): personal API tokens ─────────────────────────────────────────────────────────────────
/**
 * A person's API token for scripts: scoped to one lab and a role whose permissions are within the person's own
 * there. Only the SHA-256 of the token is kept; `prefix` (its first characters) lets the account page tell tokens
 * apart. A revoked token stays listed (revokedAt) and never works again.
 */
export const apiTokens = pgTable(
  'api_tokens',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    role: roleEnum('role').notNull(),
    name: varchar('name', { length: 80 }).notNull(),
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    prefix: varchar('prefix', { length: 12 }).notNull(),
    createdAt: createdAt(),
    lastUsedAt: timestamp('last_used_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  t => [uniqueIndex('api_tokens_hash_idx').on(t.tokenHash), index('api_tokens_user_idx').on(t.userId)],
)
export type ApiToken = typeof apiTokens.$inferSelect
// ── Bench results and calibration (bench helper, issue 13) ────────────────────────────────────────────────────────

/** A chip run at the bench: one operating point of a revision (or conditions typed at the bench) and what was measured. */
export const benchRuns = pgTable(
  'bench_runs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    designId: uuid('design_id')
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    revisionId: uuid('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    /** The revision's operating point the run followed; the actual settings are in `conditions`. */
    operatingPointId: varchar('operating_point_id', { length: 64 }),
    junctionId: varchar('junction_id', { length: 64 }),
    conditions: jsonb('conditions').$type<Record<string, unknown>>().notNull().default({}),
    /** What the chip was made to, when known (as-built widths and depth, µm). */
    asBuilt: jsonb('as_built').$type<Record<string, unknown> | null>(),
    quantity: varchar('quantity', { length: 16 }).notNull().default('diameter'),
    source: varchar('source', { length: 16 }).notNull(),
    /** Measured sizes, µm; the summary columns are computed from them. */
    valuesUm: jsonb('values_um').$type<number[]>().notNull().default([]),
    count: integer('count').notNull().default(0),
    meanUm: doublePrecision('mean_um'),
    sdUm: doublePrecision('sd_um'),
    cv: doublePrecision('cv'),
    frequencyHz: doublePrecision('frequency_hz'),
    /** The forecast at the run's conditions, kept with the run (sphere-equivalent diameter, regime, flow ratio…). */
    predicted: jsonb('predicted').$type<Record<string, unknown> | null>(),
    notes: text('notes').notNull().default(''),
    ranBy: uuid('ran_by')
      .notNull()
      .references(() => users.id),
    ranAt: timestamp('ran_at', { withTimezone: true }).notNull(),
    createdAt: createdAt(),
  },
  t => [index('bench_runs_revision_idx').on(t.revisionId), index('bench_runs_lab_idx').on(t.labId, t.ranAt)],
)

/** A micrograph of a run: the bytes live in object storage under `objectKey`; the row keeps metadata and the result. */
export const benchMicrographs = pgTable(
  'bench_micrographs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    runId: uuid('run_id')
      .notNull()
      .references(() => benchRuns.id, { onDelete: 'cascade' }),
    objectKey: varchar('object_key', { length: 300 }).notNull(),
    thumbnailKey: varchar('thumbnail_key', { length: 300 }),
    contentType: varchar('content_type', { length: 40 }).notNull(),
    bytes: integer('bytes').notNull(),
    fileName: varchar('file_name', { length: 200 }).notNull().default(''),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    umPerPx: doublePrecision('um_per_px').notNull(),
    /** queued → measuring → done | failed; progress 0–1 while measuring. */
    status: varchar('status', { length: 16 }).notNull().default('queued'),
    progress: doublePrecision('progress').notNull().default(0),
    error: text('error'),
    measurement: jsonb('measurement').$type<Record<string, unknown> | null>(),
    excluded: jsonb('excluded').$type<number[]>().notNull().default([]),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  t => [index('bench_micrographs_run_idx').on(t.runId)],
)

/** Which forecast a design shows: the model's, or the model corrected by the lab's calibration. */
export const designForecastModes = pgTable('design_forecast_modes', {
  designId: uuid('design_id')
    .primaryKey()
    .references(() => designs.id, { onDelete: 'cascade' }),
  labId: uuid('lab_id')
    .notNull()
    .references(() => labs.id, { onDelete: 'cascade' }),
  mode: varchar('mode', { length: 16 }).notNull().default('model'),
  changedBy: uuid('changed_by')
    .notNull()
    .references(() => users.id),
  changedAt: timestamp('changed_at', { withTimezone: true }).notNull().defaultNow(),
})

export type BenchRun = typeof benchRuns.$inferSelect
export type BenchMicrograph = typeof benchMicrographs.$inferSelect

// ── fab (issue 15 items 1-4): fabrication orders, their messages, as-built reports and their files ──
export const orderStatusEnum = pgEnum('order_status', ORDER_STATUSES)
export const substrateEnum = pgEnum('order_substrate', SUBSTRATES)
export const maskPolarityEnum = pgEnum('mask_polarity', MASK_POLARITIES)
export const maskMediumEnum = pgEnum('mask_medium', MASK_MEDIA)

/** What a release asks the fabrication partner to make; one per released revision. */
export const fabOrders = pgTable(
  'fab_orders',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    revisionId: uuid('revision_id')
      .notNull()
      .unique()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    releaseId: uuid('release_id')
      .notNull()
      .unique()
      .references(() => releases.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    status: orderStatusEnum('status').notNull().default('received'),
    statusAt: timestamp('status_at', { withTimezone: true }).notNull().defaultNow(),
    holdReason: text('hold_reason'),
    quantity: integer('quantity').notNull().default(1),
    substrate: substrateEnum('substrate').notNull().default('pdms-on-glass'),
    maskPolarity: maskPolarityEnum('mask_polarity').notNull().default('positive'),
    maskMedium: maskMediumEnum('mask_medium').notNull().default('film'),
    dueDate: varchar('due_date', { length: 10 }),
    poNumber: varchar('po_number', { length: 60 }).notNull().default(''),
    notes: text('notes').notNull().default(''),
    trackingNumber: varchar('tracking_number', { length: 80 }),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  t => [
    index('fab_orders_lab_idx').on(t.labId, t.status),
    uniqueIndex('fab_orders_lab_number_idx').on(t.labId, t.number),
  ],
)

/** The thread between the lab and the fab on an order; a status move with a note is a message too. */
export const fabOrderMessages = pgTable(
  'fab_order_messages',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    orderId: uuid('order_id')
      .notNull()
      .references(() => fabOrders.id, { onDelete: 'cascade' }),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    authorId: uuid('author_id')
      .notNull()
      .references(() => users.id),
    body: text('body').notNull(),
    /** The status the order moved to with this message, if it was a move. */
    status: orderStatusEnum('status'),
    createdAt: createdAt(),
  },
  t => [index('fab_order_messages_order_idx').on(t.orderId, t.createdAt)],
)

/** What was actually made: measured depths per layer and widths at named elements. The latest one counts. */
export const asBuilts = pgTable(
  'as_builts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    revisionId: uuid('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    depths: jsonb('depths').$type<Array<{ layerId: string; depthUm: number }>>().notNull(),
    widths: jsonb('widths').$type<Array<{ elementId: string; widthUm: number }>>().notNull(),
    note: text('note').notNull().default(''),
    /** The as-built chip document and its summary (forecast + rules), computed once when recorded. */
    document: jsonb('document').$type<Record<string, unknown>>().notNull(),
    summary: jsonb('summary').$type<Record<string, unknown>>().notNull(),
    recordedBy: uuid('recorded_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  t => [index('as_builts_revision_idx').on(t.revisionId, t.createdAt)],
)

/** A file of an as-built report (profilometer CSV, photo): bytes in object storage under `objectKey`. */
export const asBuiltFiles = pgTable(
  'as_built_files',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    asBuiltId: uuid('as_built_id')
      .notNull()
      .references(() => asBuilts.id, { onDelete: 'cascade' }),
    objectKey: varchar('object_key', { length: 300 }).notNull(),
    contentType: varchar('content_type', { length: 60 }).notNull(),
    bytes: integer('bytes').notNull(),
    fileName: varchar('file_name', { length: 200 }).notNull().default(''),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  t => [index('as_built_files_as_built_idx').on(t.asBuiltId)],
)

export type FabOrder = typeof fabOrders.$inferSelect

// ── libraries (issue 15 items 5-6): the lab's own liquids, liquid pairs and fabrication processes ──
/**
 * One entry of a lab's library. `kind` is liquid | pair | process; `key` is the id documents use ("lab-…" for
 * liquids and processes, "<a>/<b>/<surfactant>" for pairs), unique per lab and kind; `data` holds the values in
 * the shape of shared/schemas/libraries.ts (validated there). Archived entries stay, so old documents still name them.
 */
export const labLibraryEntries = pgTable(
  'lab_library_entries',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    kind: varchar('kind', { length: 16 }).notNull(),
    key: varchar('key', { length: 200 }).notNull(),
    name: varchar('name', { length: 200 }).notNull(),
    source: text('source').notNull(),
    data: jsonb('data').$type<Record<string, unknown>>().notNull(),
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedBy: uuid('updated_by')
      .notNull()
      .references(() => users.id),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  t => [uniqueIndex('lab_library_entries_key_idx').on(t.labId, t.kind, t.key)],
)

export type LabLibraryEntry = typeof labLibraryEntries.$inferSelect
