import { mysqlTable, int, varchar, char, datetime, json, smallint, uniqueIndex, index } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { users } from './users'

// API tokens for automated profile feeds. Only the SHA-256 of the token is kept; the token is shown once.
export const apiTokens = mysqlTable('api_tokens', {
  id: int('id').autoincrement().primaryKey(),
  name: varchar('name', { length: 120 }).notNull(),
  tokenHash: char('token_hash', { length: 64 }).notNull(),
  // The first characters, so a person can tell their tokens apart.
  tokenPrefix: varchar('token_prefix', { length: 16 }).notNull(),
  createdByUserId: int('created_by_user_id').notNull().references(() => users.id),
  createdAt: datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  lastUsedAt: datetime('last_used_at', { mode: 'date', fsp: 3 }),
  revokedAt: datetime('revoked_at', { mode: 'date', fsp: 3 }),
  revokedByUserId: int('revoked_by_user_id').references(() => users.id),
}, t => [uniqueIndex('api_tokens_hash').on(t.tokenHash)])

// First answers to requests sent with an Idempotency-Key, replayed when the same key comes again.
export const idempotencyKeys = mysqlTable('idempotency_keys', {
  id: int('id').autoincrement().primaryKey(),
  // Who sent it: 'token:<id>' or 'user:<id>', so two callers' keys never meet.
  scope: varchar('scope', { length: 40 }).notNull(),
  idemKey: varchar('idem_key', { length: 200 }).notNull(),
  route: varchar('route', { length: 200 }).notNull(),
  requestHash: char('request_hash', { length: 64 }).notNull(),
  responseStatus: smallint('response_status').notNull(),
  responseBody: json('response_body').$type<unknown>().notNull(),
  createdAt: datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  uniqueIndex('idempotency_scope_key').on(t.scope, t.idemKey),
  index('idempotency_created').on(t.createdAt),
])

export type ApiToken = typeof apiTokens.$inferSelect
