import { mysqlTable, int, char, datetime, index } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { users } from './users'

const at = (name: string) => datetime(name, { mode: 'date', fsp: 3 })

// One row per signed-in browser. The sealed cookie carries a random session id; only its SHA-256 is kept here.
// Deleting the row ends that session on its next request (sign-out, sign out everywhere, reset, role change).
export const userSessions = mysqlTable('user_sessions', {
  idHash: char('id_hash', { length: 64 }).primaryKey(),
  userId: int('user_id').notNull().references(() => users.id),
  createdAt: at('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  // Refreshed at most once a minute by the requests of this session; the idle limit counts from it.
  lastSeenAt: at('last_seen_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  // The absolute end, fixed at sign-in.
  expiresAt: at('expires_at').notNull(),
}, t => [index('user_sessions_user').on(t.userId)])

export type UserSession = typeof userSessions.$inferSelect
