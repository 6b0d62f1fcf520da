import { z } from 'zod'
import { M_PER_FT, MPS_PER_KT } from '../units'
import { airfieldCodeField } from './airfield-schema'
import { instantSchema, pageSchema, pageSizeSchema } from './input-schemas'

// The public profile JSON shape (README "Profile JSON"), shared by the API, the import parsers and the entry form.
// The wind engine's normaliseProfile stays the authority on whole-profile rules (ground, duplicates, surface gust).

export const PROFILE_SOURCES = ['radiosonde', 'wind-profiler', 'doppler-lidar', 'aircraft-reports', 'model-forecast', 'pilot-report', 'estimate', 'coded-report'] as const
export type ProfileSourceName = typeof PROFILE_SOURCES[number]
export const PROFILE_SOURCE_LABELS: Record<ProfileSourceName, string> = {
  'radiosonde': 'Radiosonde',
  'wind-profiler': 'Wind profiler',
  'doppler-lidar': 'Doppler lidar',
  'aircraft-reports': 'Aircraft reports',
  'model-forecast': 'Model forecast',
  'pilot-report': 'Pilot report',
  'estimate': 'Estimate',
  'coded-report': 'Coded report (METAR/TAF)',
}
export const HEIGHT_REFERENCES = ['AGL', 'MSL'] as const
export const PROFILE_ENTRY_METHODS = ['table', 'file', 'coded', 'api'] as const
export type ProfileEntryMethod = typeof PROFILE_ENTRY_METHODS[number]

export const PROFILE_MAX_LEVELS = 5000
export const PROFILE_MAX_BYTES = 2 * 1024 * 1024
// A profile describes hours, not weeks: a longer validity is almost surely a typing slip.
export const PROFILE_MAX_VALIDITY_H = 72
export const PROFILE_MAX_SPEED_KT = 250
const MAX_HEIGHT_M = 29000

const num = (label: string) => z.number({ required_error: `${label} is required`, invalid_type_error: `${label} must be a number` }).finite(`${label} must be a finite number`)

export const LEVEL_HEIGHT_KEYS = ['heightM', 'heightFt', 'pressureHpa'] as const
export const LEVEL_SPEED_KEYS = ['speedKt', 'speedMps'] as const
export const LEVEL_GUST_KEYS = ['gustKt', 'gustMps'] as const

/** One level: exactly one of heightM | heightFt | pressureHpa, directionDeg, exactly one of speedKt | speedMps, an optional gust. */
export const profileLevelSchema = z.object({
  heightM: num('Height').min(-500, 'Height must be -500 m or more').max(MAX_HEIGHT_M, `Height must be at most ${MAX_HEIGHT_M} m`).optional(),
  heightFt: num('Height').min(-1640, 'Height must be -1640 ft or more').max(MAX_HEIGHT_M / M_PER_FT, 'Height must be at most 95,000 ft').optional(),
  pressureHpa: num('Pressure').gt(0, 'Pressure must be above 0 hPa').max(1100, 'Pressure must be at most 1100 hPa').optional(),
  directionDeg: num('Direction').min(0, 'Direction must be 0 to 360°').max(360, 'Direction must be 0 to 360°'),
  speedKt: num('Speed').min(0, 'Speed must be 0 or more').max(PROFILE_MAX_SPEED_KT, `Speed must be at most ${PROFILE_MAX_SPEED_KT} kt`).optional(),
  speedMps: num('Speed').min(0, 'Speed must be 0 or more').max(PROFILE_MAX_SPEED_KT * MPS_PER_KT, 'Speed must be at most 128 m/s').optional(),
  gustKt: num('Gust').min(0, 'Gust must be 0 or more').max(PROFILE_MAX_SPEED_KT, `Gust must be at most ${PROFILE_MAX_SPEED_KT} kt`).optional(),
  gustMps: num('Gust').min(0, 'Gust must be 0 or more').max(PROFILE_MAX_SPEED_KT * MPS_PER_KT, 'Gust must be at most 128 m/s').optional(),
  temperatureC: num('Temperature').min(-90, 'Temperature must be from -90 to 60 °C').max(60, 'Temperature must be from -90 to 60 °C').optional(),
}).strict().superRefine((level, ctx) => {
  const given = (keys: readonly (keyof typeof level)[]) => keys.filter(k => level[k] !== undefined)
  // A height and a pressure may come together (the height wins); two heights may not.
  const lengths = given(['heightM', 'heightFt'])
  if (lengths.length > 1) ctx.addIssue({ code: z.ZodIssueCode.custom, path: [lengths[1]!], message: 'Give one height only: metres or feet (a pressure level may come with it)' })
  else if (!given(LEVEL_HEIGHT_KEYS).length) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['heightM'], message: 'Height is required' })
  const speeds = given(LEVEL_SPEED_KEYS)
  if (speeds.length !== 1) ctx.addIssue({ code: z.ZodIssueCode.custom, path: [speeds[1] ?? 'speedKt'], message: speeds.length ? 'Give one speed only: knots or metres per second' : 'Speed is required' })
  const gusts = given(LEVEL_GUST_KEYS)
  if (gusts.length > 1) ctx.addIssue({ code: z.ZodIssueCode.custom, path: [gusts[1]!], message: 'Give at most one gust' })
  const speedKt = level.speedKt ?? (level.speedMps === undefined ? undefined : level.speedMps / MPS_PER_KT)
  const gustKt = level.gustKt ?? (level.gustMps === undefined ? undefined : level.gustMps / MPS_PER_KT)
  if (speedKt !== undefined && gustKt !== undefined && gustKt < speedKt) ctx.addIssue({ code: z.ZodIssueCode.custom, path: [gusts[0]!], message: 'Gust must not be below the mean speed' })
})
export type ProfileLevelInput = z.infer<typeof profileLevelSchema>

// A real date and time with a real offset, in 1970 to 2100 (shared/utils/input-schemas.ts).
const utcInstant = (label: string) => instantSchema(label)

export const profileLevelsSchema = z.array(profileLevelSchema, { required_error: 'Levels are required' })
  .min(2, 'At least two levels are needed').max(PROFILE_MAX_LEVELS, `At most ${PROFILE_MAX_LEVELS} levels`)

const profileHeaderShape = {
  validFrom: utcInstant('Valid from'),
  validTo: utcInstant('Valid to'),
  source: z.enum(PROFILE_SOURCES, { errorMap: () => ({ message: `Source must be one of ${PROFILE_SOURCES.join(', ')}` }) }),
  heightReference: z.enum(HEIGHT_REFERENCES, { errorMap: () => ({ message: 'Height reference must be AGL or MSL' }) }),
  notes: z.string().max(2000, 'Notes: at most 2000 characters').optional(),
  qnhHpa: num('QNH').min(850, 'QNH must be from 850 to 1100 hPa').max(1100, 'QNH must be from 850 to 1100 hPa').optional(),
  surfacePressureHpa: num('Station pressure').min(300, 'Station pressure must be from 300 to 1100 hPa').max(1100, 'Station pressure must be from 300 to 1100 hPa').optional(),
  // Source 'coded-report': the report lines as pasted; their station and age warnings must be confirmed.
  codedReport: z.object({
    text: z.string({ required_error: 'Paste the report lines' }).min(1, 'Paste the report lines').max(20_000, 'At most 20,000 characters'),
    confirmWarnings: z.boolean().optional(),
    // A profile for one period of a TAF (POST .../profiles/periods): its line and the period's place.
    period: z.object({ line: z.number().int().min(1), index: z.number().int().min(0) }).strict().optional(),
  }).strict().optional(),
}

function checkValidity(p: { validFrom: string, validTo: string, source?: string, codedReport?: unknown }, ctx: z.RefinementCtx) {
  if (p.source === 'coded-report' && !p.codedReport) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['codedReport'], message: 'A profile from coded reports needs the report lines: paste them under "Paste coded reports" and read them' })
  const from = Date.parse(p.validFrom)
  const to = Date.parse(p.validTo)
  if (!(to > from)) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['validTo'], message: 'Valid to must be after valid from' })
  else if (to - from > PROFILE_MAX_VALIDITY_H * 3600_000) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['validTo'], message: `A profile may be valid for at most ${PROFILE_MAX_VALIDITY_H} hours` })
}

/** The header fields of a profile (the entry form validates these apart from the level table). */
export const profileHeaderSchema = z.object(profileHeaderShape).strict().superRefine(checkValidity)

/** A whole profile as filed through the API. */
export const profileInputSchema = z.object({ ...profileHeaderShape, levels: profileLevelsSchema }).strict().superRefine(checkValidity)
export type ProfileInput = z.infer<typeof profileInputSchema>

/** Body of POST /api/wind/preview: the levels with an airfield code, or runway ends and an elevation. */
export const windPreviewSchema = z.object({
  levels: profileLevelsSchema,
  heightReference: z.enum(HEIGHT_REFERENCES, { errorMap: () => ({ message: 'Height reference must be AGL or MSL' }) }),
  airfield: airfieldCodeField('Airfield').optional(),
  runwayEnds: z.array(z.object({
    designator: z.string().trim().regex(/^(0[1-9]|[12]\d|3[0-6])[LCR]?$/, 'Designator must be 01 to 36 with an optional L, C or R'),
    trueHeadingDeg: num('True heading').min(0).max(360),
  }).strict()).max(64).optional(),
  elevationM: num('Elevation').min(-500).max(9000).optional(),
  qnhHpa: num('QNH').min(850, 'QNH must be from 850 to 1100 hPa').max(1100, 'QNH must be from 850 to 1100 hPa').optional(),
  surfacePressureHpa: num('Station pressure').min(300, 'Station pressure must be from 300 to 1100 hPa').max(1100, 'Station pressure must be from 300 to 1100 hPa').optional(),
}).strict().superRefine((p, ctx) => {
  if (p.airfield && p.runwayEnds) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['airfield'], message: 'Give an airfield or runwayEnds, not both' })
  if (!p.airfield && p.heightReference === 'MSL' && p.elevationM === undefined) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['elevationM'], message: 'MSL heights need elevationM (or an airfield)' })
})

/** Turns a level's height into the unit-tagged pair the table shows. */
export function levelHeightOf(level: ProfileLevelInput): { value: number, unit: 'm' | 'ft' | 'hPa' } {
  if (level.heightM !== undefined) return { value: level.heightM, unit: 'm' }
  if (level.heightFt !== undefined) return { value: level.heightFt, unit: 'ft' }
  return { value: level.pressureHpa ?? Number.NaN, unit: 'hPa' }
}

/** Query of GET /api/airfields/{code}/profiles. */
export const profileListQuerySchema = z.object({
  from: instantSchema('from').optional(),
  to: instantSchema('to').optional(),
  source: z.enum(PROFILE_SOURCES).optional(),
  status: z.enum(['active', 'superseded', 'withdrawn']).optional(),
  sort: z.enum(['validFrom', 'validTo', 'createdAt', 'source', 'status']).default('validFrom'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: pageSchema,
  pageSize: pageSizeSchema(200, 25),
})

/** Query of GET /api/audit. */
export const auditQuerySchema = z.object({
  entityType: z.enum(['airfield', 'runway', 'profile', 'api-token', 'user']).optional(),
  action: z.string().trim().max(64).optional(),
  actor: z.string().trim().max(160).optional(),
  q: z.string().trim().max(100).optional(),
  from: instantSchema('from').optional(),
  to: instantSchema('to').optional(),
  page: pageSchema,
  pageSize: pageSizeSchema(200, 50),
})

export const withdrawSchema = z.object({
  reason: z.string({ required_error: 'Give a reason for withdrawing' }).trim().min(3, 'Give a reason for withdrawing (at least 3 characters)').max(500, 'Reason: at most 500 characters'),
}).strict()

export const tokenCreateSchema = z.object({
  name: z.string({ required_error: 'Name is required' }).trim().min(1, 'Name is required').max(120, 'Name: at most 120 characters'),
}).strict()
