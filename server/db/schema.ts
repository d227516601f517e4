// Dropwright's tables. Migrations are generated from this file by drizzle-kit (`npm run db:generate`)
// and committed with their snapshots in server/db/migrations; never hand-written.
import { sql } from 'drizzle-orm'
import { index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid, varchar } from 'drizzle-orm/pg-core'
import { ROLES } from '../../shared/utils/roles'

export const roleEnum = pgEnum('role', ROLES)
export const labKindEnum = pgEnum('lab_kind', ['research', 'fabrication'])

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow()

export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  email: varchar('email', { length: 254 }).notNull(),
  name: varchar('name', { length: 120 }).notNull(),
  passwordHash: text('password_hash').notNull(),
  createdAt: createdAt(),
}, t => [uniqueIndex('users_email_lower_idx').on(sql`lower(${t.email})`)])

export const labs = pgTable('labs', {
  id: uuid('id').primaryKey().defaultRandom(),
  slug: varchar('slug', { length: 64 }).notNull().unique(),
  name: varchar('name', { length: 120 }).notNull(),
  kind: labKindEnum('kind').notNull().default('research'),
  createdAt: createdAt(),
})

export const memberships = pgTable('memberships', {
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  labId: uuid('lab_id').notNull().references(() => labs.id, { onDelete: 'cascade' }),
  role: roleEnum('role').notNull(),
  createdAt: createdAt(),
}, t => [primaryKey({ columns: [t.userId, t.labId] }), index('memberships_lab_idx').on(t.labId)])

/** Server-side sessions: the cookie holds a random token, the table only its SHA-256. */
export const sessions = pgTable('sessions', {
  tokenHash: varchar('token_hash', { length: 64 }).primaryKey(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  createdAt: createdAt(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
}, t => [index('sessions_user_idx').on(t.userId), index('sessions_expires_idx').on(t.expiresAt)])

/** Failed sign-ins, kept in the database so throttling holds across server instances. */
export const signInFailures = pgTable('sign_in_failures', {
  id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
  email: varchar('email', { length: 254 }).notNull(),
  ip: varchar('ip', { length: 64 }).notNull(),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('sign_in_failures_email_idx').on(t.email, t.at), index('sign_in_failures_ip_idx').on(t.ip, t.at)])

export type User = typeof users.$inferSelect
export type Lab = typeof labs.$inferSelect
export type Membership = typeof memberships.$inferSelect
export type Session = typeof sessions.$inferSelect
