import { mysqlTable, bigint, int, varchar, datetime, json, index } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { users } from './users'

// Who did what to which thing, and when. Rows are only ever inserted.
export const auditLog = mysqlTable('audit_log', {
  id: bigint('id', { mode: 'number' }).autoincrement().primaryKey(),
  at: datetime('at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  actorUserId: int('actor_user_id').references(() => users.id),
  // e.g. 'api-token:12' when a feed acted rather than a person
  actorLabel: varchar('actor_label', { length: 160 }).notNull(),
  action: varchar('action', { length: 64 }).notNull(),
  entityType: varchar('entity_type', { length: 32 }).notNull(),
  entityId: varchar('entity_id', { length: 64 }).notNull(),
  details: json('details').$type<Record<string, unknown>>(),
}, t => [
  index('audit_log_at').on(t.at),
  index('audit_log_entity').on(t.entityType, t.entityId),
])

export type AuditEntry = typeof auditLog.$inferSelect

// Small key/value facts about this database, e.g. which demo seed parts have run.
export const appMeta = mysqlTable('app_meta', {
  key: varchar('meta_key', { length: 64 }).primaryKey(),
  value: varchar('meta_value', { length: 255 }).notNull(),
  updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
})
