import geodesic from 'geographiclib-geodesic'
import { normaliseHeadingDeg } from './angles'
import { WindValidationError, describeValue } from './errors'
import type { ValidationIssue } from './types'

const WGS84 = geodesic.Geodesic.WGS84

function checkCoordinate(issues: ValidationIssue[], value: unknown, field: string, limit: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || Math.abs(value) > limit) {
    issues.push({ field, message: `must be a number from -${limit} to ${limit} degrees, got ${describeValue(value)}` })
  }
}

/**
 * True bearing (0, 360] from threshold 1 towards threshold 2 on the WGS84 ellipsoid, by Karney's geodesic inverse
 * (geographiclib-geodesic): the true heading of the runway end at threshold 1.
 */
export function runwayTrueBearingDeg(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): number {
  const issues: ValidationIssue[] = []
  checkCoordinate(issues, lat1Deg, 'lat1Deg', 90)
  checkCoordinate(issues, lon1Deg, 'lon1Deg', 540)
  checkCoordinate(issues, lat2Deg, 'lat2Deg', 90)
  checkCoordinate(issues, lon2Deg, 'lon2Deg', 540)
  if (issues.length) throw new WindValidationError(issues)
  const r = WGS84.Inverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg)
  if (!(typeof r.s12 === 'number' && r.s12 > 0.01) || typeof r.azi1 !== 'number') {
    throw new WindValidationError([{ field: 'thresholds', message: 'the two thresholds are at the same place: no bearing' }])
  }
  return normaliseHeadingDeg(r.azi1)
}

/** Distance in metres between two thresholds on the WGS84 ellipsoid (Karney's geodesic inverse, s12). */
export function thresholdDistanceM(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): number {
  const r = WGS84.Inverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg)
  return typeof r.s12 === 'number' ? r.s12 : Number.NaN
}
