import { mysqlTable, int, varchar, datetime, double, text, mysqlEnum, uniqueIndex, index, json } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'

export const airfields = mysqlTable('airfields', {
  id: int('id').autoincrement().primaryKey(),
  // Four letters, stored upper-case; unique whatever the case it was typed in.
  code: varchar('code', { length: 4 }).notNull(),
  name: varchar('name', { length: 120 }).notNull(),
  latitudeDeg: double('latitude_deg').notNull(),
  longitudeDeg: double('longitude_deg').notNull(),
  elevationM: double('elevation_m').notNull(),
  // The unit the elevation was entered in, for display.
  elevationUnit: mysqlEnum('elevation_unit', ['ft', 'm']).notNull().default('ft'),
  // East positive. Null: computed with the World Magnetic Model for the date asked.
  magVarOverrideDeg: double('mag_var_override_deg'),
  magVarOverrideReason: varchar('mag_var_override_reason', { length: 255 }),
  notes: text('notes'),
  // The location indicator its coded reports carry; null: the airfield's code.
  reportingStation: varchar('reporting_station', { length: 4 }),
  // Approach and departure geometry for the corridor check and the F-factor; null: the engine's defaults.
  pathSettings: json('path_settings').$type<Partial<{ corridorNm: number, arrivalGlidePathDeg: number, arrivalTrueAirspeedKt: number, departureClimbDeg: number, departureTrueAirspeedKt: number }> | null>(),
  createdAt: datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [uniqueIndex('airfields_code').on(t.code)])

// A physical runway; its two ends are rows of runway_ends.
export const runways = mysqlTable('runways', {
  id: int('id').autoincrement().primaryKey(),
  airfieldId: int('airfield_id').notNull().references(() => airfields.id),
  lengthM: double('length_m'),
  createdAt: datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [index('runways_airfield').on(t.airfieldId)])

export const runwayEnds = mysqlTable('runway_ends', {
  id: int('id').autoincrement().primaryKey(),
  runwayId: int('runway_id').notNull().references(() => runways.id),
  airfieldId: int('airfield_id').notNull().references(() => airfields.id),
  // 01..36 with an optional L, C or R
  designator: varchar('designator', { length: 3 }).notNull(),
  thresholdLatDeg: double('threshold_lat_deg'),
  thresholdLonDeg: double('threshold_lon_deg'),
  thresholdElevationM: double('threshold_elevation_m'),
  // From the two thresholds by the geodesic inverse, or entered where the coordinates are unknown.
  trueHeadingDeg: double('true_heading_deg').notNull(),
  headingSource: mysqlEnum('heading_source', ['coordinates', 'entered']).notNull(),
}, t => [
  index('runway_ends_runway').on(t.runwayId),
  uniqueIndex('runway_ends_airfield_designator').on(t.airfieldId, t.designator),
])

export type Airfield = typeof airfields.$inferSelect
export type Runway = typeof runways.$inferSelect
export type RunwayEnd = typeof runwayEnds.$inferSelect
