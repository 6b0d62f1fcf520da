import { mysqlTable, int, varchar, datetime, mysqlEnum, boolean, index } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'

export const roles = ['admin', 'dispatcher', 'pilot', 'safety'] as const
export type Role = typeof roles[number]

export const users = mysqlTable('users', {
  id: int('id').autoincrement().primaryKey(),
  email: varchar('email', { length: 254 }).notNull().unique(),
  name: varchar('name', { length: 120 }).notNull(),
  role: mysqlEnum('role', roles).notNull(),
  // null until an invited user sets a password
  passwordHash: varchar('password_hash', { length: 255 }),
  disabled: boolean('disabled').notNull().default(false),
  createdAt: datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
})

// Failed sign-ins, counted per e-mail and per client address for the 15-minute lockout.
export const signInFailures = mysqlTable('sign_in_failures', {
  id: int('id').autoincrement().primaryKey(),
  email: varchar('email', { length: 254 }).notNull(),
  clientAddress: varchar('client_address', { length: 64 }).notNull(),
  at: datetime('at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  index('sign_in_failures_email_at').on(t.email, t.at),
  index('sign_in_failures_addr_at').on(t.clientAddress, t.at),
])

export type User = typeof users.$inferSelect
export type NewUser = typeof users.$inferInsert
