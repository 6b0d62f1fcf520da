import { z } from 'zod'
import { M_PER_FT } from '../units'
import { PATH_RANGES } from '../wind/validate'
import { COORDINATE_EXAMPLES, coordinateOrTyped, type Axis } from './coordinates'
import { pageSchema, pageSizeSchema } from './input-schemas'
import { AIRFIELD_PAGE_SIZE } from './page-sizes'

// Airfields and runways: shared by the API and the forms.

export const AIRFIELD_CODE_RE = /^[A-Za-z]{4}$/
/** The one airfield code rule (four letters, any case, answered upper case), labelled in the words of its form. */
export const airfieldCodeField = (label = 'Code') => z.string({ required_error: `${label} is required` }).trim()
  .regex(AIRFIELD_CODE_RE, `${label} must be four letters, e.g. XVAL`).transform(c => c.toUpperCase())
export const airfieldCodeSchema = airfieldCodeField('Code')
export const airfieldCodeParamSchema = z.object({ code: airfieldCodeSchema })

const deg = (label: string, limit: number) => z.number({ required_error: `${label} is required`, invalid_type_error: `${label} must be a number` })
  .finite().min(-limit, `${label} must be from -${limit} to ${limit}°`).max(limit, `${label} must be from -${limit} to ${limit}°`)

/** A latitude or longitude: a number, or text in decimal degrees or degrees-minutes(-seconds) with N/S/E/W. */
const coordinate = (label: string, axis: Axis) => {
  const limit = axis === 'lat' ? 90 : 180
  const range = `${label} must be from -${limit} to ${limit}°`
  return z.preprocess(v => coordinateOrTyped(v, axis), z.number({ required_error: `${label} is required`, invalid_type_error: `${label}: give ${COORDINATE_EXAMPLES[axis]}` })
    .finite(range).min(-limit, range).max(limit, range))
}

const airfieldShape = {
  code: airfieldCodeSchema,
  name: z.string({ required_error: 'Name is required' }).trim().min(1, 'Name is required').max(120, 'Name: at most 120 characters'),
  latitudeDeg: coordinate('Latitude', 'lat'),
  longitudeDeg: coordinate('Longitude', 'lon'),
  elevation: z.number({ required_error: 'Elevation is required', invalid_type_error: 'Elevation must be a number' }).finite(),
  elevationUnit: z.enum(['ft', 'm'], { errorMap: () => ({ message: 'Elevation unit must be ft or m' }) }),
  magVarOverrideDeg: deg('Magnetic variation', 180).nullable().optional(),
  magVarOverrideReason: z.string().trim().max(255, 'Reason: at most 255 characters').nullable().optional(),
  notes: z.string().max(4000, 'Notes: at most 4000 characters').nullable().optional(),
  // The location indicator its coded reports carry; empty or null: the airfield's own code.
  reportingStation: z.string().trim().transform(s => s.toUpperCase())
    .refine(s => s === '' || /^[A-Z][A-Z0-9]{3}$/.test(s), 'Reporting station must be a four-character location indicator, e.g. XVAL')
    .transform(s => s || null).nullable().optional(),
  // Approach and departure geometry for the corridor check and the F-factor; a setting left out keeps the default
  // (3 NM corridor, 3.0° at 140 kt, 6.0° at 160 kt); null: all defaults.
  pathSettings: z.object(pathSettingShape()).strict().nullable().optional(),
}

function pathSettingShape() {
  const labels = { corridorNm: 'Corridor length', arrivalGlidePathDeg: 'Glide path', arrivalTrueAirspeedKt: 'Arrival true airspeed', departureClimbDeg: 'Climb angle', departureTrueAirspeedKt: 'Departure true airspeed' } as const
  return Object.fromEntries(Object.entries(PATH_RANGES).map(([k, r]) => {
    const label = labels[k as keyof typeof labels]
    const msg = `${label} must be from ${r.min} to ${r.max}${r.unit === '°' ? '' : ' '}${r.unit}`
    return [k, z.number({ invalid_type_error: `${label} must be a number` }).finite(msg).min(r.min, msg).max(r.max, msg).optional()]
  })) as Record<keyof typeof PATH_RANGES, z.ZodOptional<z.ZodNumber>>
}

type AirfieldFields = { elevation?: number, elevationUnit?: 'ft' | 'm', magVarOverrideDeg?: number | null, magVarOverrideReason?: string | null }
function checkAirfield(a: AirfieldFields, ctx: z.RefinementCtx) {
  if (a.elevation !== undefined && a.elevationUnit !== undefined) {
    const m = a.elevationUnit === 'ft' ? a.elevation * M_PER_FT : a.elevation
    if (m < -500 || m > 9000) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['elevation'], message: 'Elevation must be from -500 to 9000 m (-1640 to 29,527 ft)' })
  }
  if (a.magVarOverrideDeg != null && !a.magVarOverrideReason?.trim()) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['magVarOverrideReason'], message: 'Give a reason for overriding the magnetic variation' })
  }
}

export const airfieldCreateSchema = z.object(airfieldShape).strict().superRefine(checkAirfield)
export const airfieldUpdateSchema = z.object(airfieldShape).partial().omit({ code: true }).strict()
  .superRefine((a, ctx) => {
    if (Object.keys(a).length === 0) ctx.addIssue({ code: z.ZodIssueCode.custom, path: [], message: 'Nothing to change' })
    if ((a.elevation === undefined) !== (a.elevationUnit === undefined)) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['elevationUnit'], message: 'Give the elevation with its unit' })
    checkAirfield(a, ctx)
  })
export type AirfieldCreate = z.infer<typeof airfieldCreateSchema>

export const DESIGNATOR_RE = /^(0[1-9]|[12]\d|3[0-6])([LCR])?$/

/**
 * The two ends of one runway: numbers 18 apart (designator = magnetic azimuth / 10, FAA AC 150/5340-1),
 * L opposite R, C opposite C, no letter opposite no letter. Returns a message, or null when they pair.
 */
export function designatorPairProblem(a: string, b: string): string | null {
  const ma = DESIGNATOR_RE.exec(a.toUpperCase())
  const mb = DESIGNATOR_RE.exec(b.toUpperCase())
  if (!ma || !mb) return 'Designators must be 01 to 36 with an optional L, C or R'
  const na = Number(ma[1])
  const nb = Number(mb[1])
  if (Math.abs(na - nb) !== 18) return `${a} and ${b} are not the two ends of one runway: their numbers must be 18 apart (e.g. 09 and 27)`
  const opposite: Record<string, string> = { 'L': 'R', 'R': 'L', 'C': 'C', '': '' }
  if (opposite[ma[2] ?? ''] !== (mb[2] ?? '')) return `${a} and ${b} do not pair: L is opposite R, C opposite C, and a plain number opposite a plain number`
  return null
}

const endSchema = z.object({
  designator: z.string({ required_error: 'Designator is required' }).trim().toUpperCase()
    .regex(DESIGNATOR_RE, 'Designator must be 01 to 36 with an optional L, C or R'),
  thresholdLatDeg: coordinate('Threshold latitude', 'lat').nullable().optional(),
  thresholdLonDeg: coordinate('Threshold longitude', 'lon').nullable().optional(),
  thresholdElevationM: z.number().finite().min(-500, 'Threshold elevation must be from -500 to 9000 m').max(9000, 'Threshold elevation must be from -500 to 9000 m').nullable().optional(),
  // Only where the threshold coordinates are unknown.
  trueHeadingDeg: z.number({ invalid_type_error: 'True heading must be a number' }).finite().gt(0, 'True heading must be above 0 and at most 360°').max(360, 'True heading must be above 0 and at most 360°').nullable().optional(),
}).strict()

export const runwaySchema = z.object({
  lengthM: z.number().finite().positive('Length must be above 0 m').max(8000, 'Length must be at most 8000 m').nullable().optional(),
  ends: z.tuple([endSchema, endSchema], { errorMap: () => ({ message: 'A runway has exactly two ends' }) }),
}).strict().superRefine((r, ctx) => {
  const [a, b] = r.ends
  const problem = designatorPairProblem(a.designator, b.designator)
  if (problem) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['ends', 1, 'designator'], message: problem })
  const hasCoords = r.ends.map(e => e.thresholdLatDeg != null && e.thresholdLonDeg != null)
  r.ends.forEach((e, i) => {
    if ((e.thresholdLatDeg == null) !== (e.thresholdLonDeg == null)) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['ends', i, e.thresholdLatDeg == null ? 'thresholdLatDeg' : 'thresholdLonDeg'], message: 'Give both threshold latitude and longitude, or neither' })
    }
  })
  if (!(hasCoords[0] && hasCoords[1])) {
    r.ends.forEach((e, i) => {
      if (e.trueHeadingDeg == null) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['ends', i, 'trueHeadingDeg'], message: 'Without both thresholds\' coordinates, enter the true heading' })
    })
  }
  else if (a.thresholdLatDeg === b.thresholdLatDeg && a.thresholdLonDeg === b.thresholdLonDeg) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['ends', 1, 'thresholdLatDeg'], message: 'The two thresholds are at the same place' })
  }
})
export type RunwayInput = z.infer<typeof runwaySchema>

// Forms: an emptied input reads as ''; the form schemas take that as "not given", then apply the very
// rules the API applies (so a field error reads the same on both sides).
export function blanksAsMissing(v: unknown): unknown {
  if (v === '') return undefined
  if (Array.isArray(v)) return v.map(blanksAsMissing)
  if (v && typeof v === 'object') return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, blanksAsMissing(x)]))
  return v
}
/** The airfield edit form: every field present (as on create, without the code), checked as the API checks it. */
export const airfieldEditFormSchema = z.preprocess(blanksAsMissing, z.object(airfieldShape).omit({ code: true }).strict().superRefine(checkAirfield))
export const runwayFormSchema = z.preprocess(blanksAsMissing, runwaySchema)

/**
 * The query of the airfield and briefing lists: a search on code or name (q), the page, its size, and (briefing
 * list) only the airfields the reader follows. Every page costs the same, however many airfields there are.
 */
export const airfieldListQuerySchema = z.object({
  q: z.string().trim().max(60, 'Search must be at most 60 characters').refine(q => ![...q].some(c => c.charCodeAt(0) < 32), 'Search must be plain text, without control characters').optional().default(''),
  page: pageSchema,
  pageSize: pageSizeSchema(100, AIRFIELD_PAGE_SIZE),
  followed: z.enum(['1', '0', 'true', 'false'], { errorMap: () => ({ message: 'followed must be 1 or 0' }) }).optional()
    .transform(v => v === '1' || v === 'true'),
})
export type AirfieldListQuery = z.infer<typeof airfieldListQuerySchema>
