import type { Airfield, RunwayEnd } from '../../db/schema'
import type { RunwayInput } from '#shared/utils/airfield-schema'
import { designatorMismatch, magneticFromTrue, runwayTrueBearingDeg, WindValidationError } from '../../../shared/wind'
import { airfieldDeclination } from '../profiles/analysis'
import { and, asc, eq, gt, lte, schema, useDB } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import { M_PER_FT } from '../../../shared/units'

// Thresholds further than this from the airfield's reference point are surely mistyped.
export const THRESHOLD_MAX_DISTANCE_KM = 15

/** Great-circle distance on a sphere of the mean Earth radius: enough to catch a mistyped coordinate. */
function roughDistanceKm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const r = Math.PI / 180
  const a = Math.sin((lat2 - lat1) * r / 2) ** 2 + Math.cos(lat1 * r) * Math.cos(lat2 * r) * Math.sin((lon2 - lon1) * r / 2) ** 2
  return 2 * 6371.0088 * Math.asin(Math.min(1, Math.sqrt(a)))
}

/** Magnetic variation today, or null when the model cannot give one (outside WMM2025 without an override). */
export function declinationToday(airfield: Airfield, now = new Date()) {
  try {
    const d = airfieldDeclination(airfield, now)
    return { declinationDeg: d.declinationDeg, source: d.source, reason: d.reason, date: now.toISOString().slice(0, 10) }
  }
  catch (err) {
    if (err instanceof WindValidationError) return null
    throw err
  }
}

/**
 * The two ends as stored: the true heading of each from the geodesic bearing between the thresholds
 * (Karney's inverse on WGS84), or as entered where the coordinates are unknown. 422 on bad coordinates.
 */
export function runwayEndValues(airfield: Airfield, input: RunwayInput) {
  const [a, b] = input.ends
  const issues: { field: string, message: string }[] = []
  input.ends.forEach((e, i) => {
    if (e.thresholdLatDeg != null && e.thresholdLonDeg != null) {
      const km = roughDistanceKm(airfield.latitudeDeg, airfield.longitudeDeg, e.thresholdLatDeg, e.thresholdLonDeg)
      if (km > THRESHOLD_MAX_DISTANCE_KM) {
        issues.push({ field: `ends[${i}].thresholdLatDeg`, message: `Threshold ${e.designator} is ${km.toFixed(0)} km from ${airfield.code}'s reference point (at most ${THRESHOLD_MAX_DISTANCE_KM} km): check the coordinates` })
      }
    }
  })
  if (issues.length) throw createError({ statusCode: 422, statusMessage: issues.map(i => i.message).join('; '), data: { issues } })
  const coords = a.thresholdLatDeg != null && a.thresholdLonDeg != null && b.thresholdLatDeg != null && b.thresholdLonDeg != null
  let headings: [number, number]
  try {
    headings = coords
      ? [runwayTrueBearingDeg(a.thresholdLatDeg!, a.thresholdLonDeg!, b.thresholdLatDeg!, b.thresholdLonDeg!),
          runwayTrueBearingDeg(b.thresholdLatDeg!, b.thresholdLonDeg!, a.thresholdLatDeg!, a.thresholdLonDeg!)]
      : [a.trueHeadingDeg!, b.trueHeadingDeg!]
  }
  catch (err) {
    if (err instanceof WindValidationError) {
      throw createError({ statusCode: 422, statusMessage: `The thresholds give no bearing: ${err.message}`, data: { issues: [{ field: 'ends[1].thresholdLatDeg', message: err.message }] } })
    }
    throw err
  }
  return input.ends.map((e, i) => ({
    airfieldId: airfield.id,
    designator: e.designator.toUpperCase(),
    thresholdLatDeg: e.thresholdLatDeg ?? null,
    thresholdLonDeg: e.thresholdLonDeg ?? null,
    thresholdElevationM: e.thresholdElevationM ?? null,
    trueHeadingDeg: headings[i]!,
    headingSource: coords ? 'coordinates' as const : 'entered' as const,
  }))
}

/** An end with its magnetic heading for the declination given and the designator check (more than 10° off). */
export function endView(end: Pick<RunwayEnd, 'designator' | 'trueHeadingDeg'> & Partial<RunwayEnd>, declinationDeg: number | null) {
  const magneticHeadingDeg = declinationDeg == null ? null : magneticFromTrue(end.trueHeadingDeg, declinationDeg)
  return {
    id: end.id,
    designator: end.designator,
    thresholdLatDeg: end.thresholdLatDeg ?? null,
    thresholdLonDeg: end.thresholdLonDeg ?? null,
    thresholdElevationM: end.thresholdElevationM ?? null,
    trueHeadingDeg: end.trueHeadingDeg,
    headingSource: end.headingSource,
    magneticHeadingDeg,
    designatorCheck: magneticHeadingDeg == null ? null : designatorMismatch(end.designator, magneticHeadingDeg),
  }
}

export function airfieldSummary(a: Airfield) {
  return {
    id: a.id,
    code: a.code,
    name: a.name,
    latitudeDeg: a.latitudeDeg,
    longitudeDeg: a.longitudeDeg,
    elevationM: a.elevationM,
    elevationFt: a.elevationM / M_PER_FT,
    elevationUnit: a.elevationUnit,
    magVarOverrideDeg: a.magVarOverrideDeg,
    magVarOverrideReason: a.magVarOverrideReason,
    notes: a.notes,
    // The station its coded reports must name (its own code unless set).
    reportingStation: a.reportingStation ?? a.code,
    // Approach and departure geometry as set (null: the engine's defaults).
    pathSettings: a.pathSettings ?? null,
    updatedAt: a.updatedAt.toISOString(),
  }
}

/** The airfield with its runways and ends, magnetic variation for today (with its date) and designator checks. */
export async function airfieldDetail(a: Airfield, db: DB | Tx = useDB()) {
  const [runways, ends] = await Promise.all([
    db.select().from(schema.runways).where(eq(schema.runways.airfieldId, a.id)).orderBy(asc(schema.runways.id)),
    db.select().from(schema.runwayEnds).where(eq(schema.runwayEnds.airfieldId, a.id)).orderBy(asc(schema.runwayEnds.id)),
  ])
  const declination = declinationToday(a)
  return {
    ...airfieldSummary(a),
    declination,
    runways: runways.map(r => ({
      id: r.id,
      lengthM: r.lengthM,
      ends: ends.filter(e => e.runwayId === r.id).map(e => endView(e, declination?.declinationDeg ?? null)),
    })),
  }
}

/** The profile in force now for an airfield, and the next one, for the airfield list. */
export async function profileStateOf(airfieldId: number, now = new Date(), db: DB | Tx = useDB()) {
  const p = schema.profiles
  const [current] = await db.select().from(p).where(and(eq(p.airfieldId, airfieldId), eq(p.status, 'active'), lte(p.validFrom, now), gt(p.validTo, now)))
    .orderBy(asc(p.validFrom)).limit(1)
  const [next] = await db.select().from(p).where(and(eq(p.airfieldId, airfieldId), eq(p.status, 'active'), gt(p.validFrom, now)))
    .orderBy(asc(p.validFrom)).limit(1)
  const brief = (x: typeof current) => x ? { id: x.id, validFrom: x.validFrom.toISOString(), validTo: x.validTo.toISOString(), source: x.source } : null
  return { state: current ? 'current' as const : next ? 'upcoming' as const : 'none' as const, current: brief(current), next: brief(next) }
}
