import { mysqlTable, int, varchar, datetime, double, text, mysqlEnum, index, json } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { airfields } from './airfields'
import { users } from './users'

import { PROFILE_SOURCES } from '../../../shared/utils/profile-schema'

export const profileSources = PROFILE_SOURCES
export type ProfileSource = typeof profileSources[number]
export const profileStatuses = ['active', 'superseded', 'withdrawn'] as const

// A filed wind profile. Nothing is ever deleted: superseded and withdrawn profiles stay, marked.
export const profiles = mysqlTable('profiles', {
  id: int('id').autoincrement().primaryKey(),
  airfieldId: int('airfield_id').notNull().references(() => airfields.id),
  validFrom: datetime('valid_from', { mode: 'date', fsp: 3 }).notNull(),
  validTo: datetime('valid_to', { mode: 'date', fsp: 3 }).notNull(),
  source: mysqlEnum('source', profileSources).notNull(),
  heightReference: mysqlEnum('height_reference', ['AGL', 'MSL']).notNull(),
  status: mysqlEnum('status', profileStatuses).notNull().default('active'),
  supersededById: int('superseded_by_id'),
  supersededAt: datetime('superseded_at', { mode: 'date', fsp: 3 }),
  withdrawnAt: datetime('withdrawn_at', { mode: 'date', fsp: 3 }),
  withdrawnReason: varchar('withdrawn_reason', { length: 500 }),
  withdrawnByUserId: int('withdrawn_by_user_id').references(() => users.id),
  filedByUserId: int('filed_by_user_id').references(() => users.id),
  // Set when an automated feed filed it with an API token.
  filedByTokenId: int('filed_by_token_id'),
  // How the levels were entered, for showing them back: { height: 'm'|'ft'|'hPa', speed: 'kt'|'mps' }, entry: 'table'|'file'|'coded'|'api'
  entry: json('entry').$type<{ height?: string, speed?: string, method?: string }>(),
  notes: text('notes'),
  // Pressure references of the day (hPa), used to place pressure levels.
  qnhHpa: double('qnh_hpa'),
  surfacePressureHpa: double('surface_pressure_hpa'),
  // The coded report lines as pasted (source 'coded-report').
  rawReport: text('raw_report'),
  // The observation time of the coded report's first METAR/SPECI: the briefing dates the data's age from it.
  observedAt: datetime('observed_at', { mode: 'date', fsp: 3 }),
  // Runway wind shear groups of the report (WS Rnn, WS ALL RWY, WS LDG/TKOF RWYnn), kept for the briefing.
  reportedWindShear: json('reported_wind_shear').$type<ReportedWindShear | null>(),
  createdAt: datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  index('profiles_airfield_valid').on(t.airfieldId, t.validFrom, t.validTo),
  index('profiles_airfield_status').on(t.airfieldId, t.status),
  // The profiles still valid (current and upcoming) of every airfield at once, for the lists.
  index('profiles_status_valid_to').on(t.status, t.validTo),
])

// The levels exactly as filed (the public level shape: one height field, one speed field, an optional gust).
export const profileLevels = mysqlTable('profile_levels', {
  id: int('id').autoincrement().primaryKey(),
  profileId: int('profile_id').notNull().references(() => profiles.id),
  seq: int('seq').notNull(),
  heightM: double('height_m'),
  heightFt: double('height_ft'),
  pressureHpa: double('pressure_hpa'),
  directionDeg: double('direction_deg').notNull(),
  speedKt: double('speed_kt'),
  speedMps: double('speed_mps'),
  gustKt: double('gust_kt'),
  gustMps: double('gust_mps'),
  temperatureC: double('temperature_c'),
}, t => [index('profile_levels_profile').on(t.profileId, t.seq)])

// Supersession by time: profile_id is superseded by superseded_by_id over [from_at, to_at). Only ever inserted.
export const profileSupersessions = mysqlTable('profile_supersessions', {
  id: int('id').autoincrement().primaryKey(),
  profileId: int('profile_id').notNull().references(() => profiles.id),
  supersededById: int('superseded_by_id').notNull().references(() => profiles.id),
  fromAt: datetime('from_at', { mode: 'date', fsp: 3 }).notNull(),
  toAt: datetime('to_at', { mode: 'date', fsp: 3 }).notNull(),
  createdAt: datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [index('profile_supersessions_profile').on(t.profileId), index('profile_supersessions_by').on(t.supersededById)])

/** Runway wind shear reported in a coded report: the runway ends named, or all of them. */
export type ReportedWindShear = { allRunways: boolean, runways: string[], groups: string[], report: string, observedAt: string | null }

export type Profile = typeof profiles.$inferSelect
export type ProfileSupersession = typeof profileSupersessions.$inferSelect
export type ProfileLevel = typeof profileLevels.$inferSelect
