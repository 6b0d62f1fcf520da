import { mysqlTable, int, datetime, mysqlEnum, uniqueIndex, index } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { users } from './users'
import { airfields } from './airfields'
import { profiles } from './profiles'

export const speedUnits = ['kt', 'mps'] as const
export const heightUnits = ['ft', 'm'] as const
export const headingRefs = ['true', 'magnetic'] as const

// How one user wants figures shown. No row: the defaults (kt, ft, true).
export const userPreferences = mysqlTable('user_preferences', {
  userId: int('user_id').primaryKey().references(() => users.id),
  speedUnit: mysqlEnum('speed_unit', speedUnits).notNull().default('kt'),
  heightUnit: mysqlEnum('height_unit', heightUnits).notNull().default('ft'),
  headingRef: mysqlEnum('heading_ref', headingRefs).notNull().default('true'),
  updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
})

// A pilot marked the briefing of one profile version as read. One row per user and profile version.
export const briefingReceipts = mysqlTable('briefing_receipts', {
  id: int('id').autoincrement().primaryKey(),
  userId: int('user_id').notNull().references(() => users.id),
  profileId: int('profile_id').notNull().references(() => profiles.id),
  airfieldId: int('airfield_id').notNull().references(() => airfields.id),
  readAt: datetime('read_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  uniqueIndex('briefing_receipts_user_profile').on(t.userId, t.profileId),
  index('briefing_receipts_airfield').on(t.airfieldId, t.readAt),
])

export type UserPreferences = typeof userPreferences.$inferSelect
export type BriefingReceipt = typeof briefingReceipts.$inferSelect
