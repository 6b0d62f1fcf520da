import geomagnetism from 'geomagnetism'
import type { GeomagnetismModel } from 'geomagnetism'
import { normaliseHeadingDeg } from './angles'
import { WindValidationError, describeValue } from './errors'
import type { DeclinationQuery, ValidationIssue } from './types'

/** Validity of WMM2025 as shipped in npm geomagnetism 0.2.0 (NOAA/BGS: 2024-11-13 to 2029-11-13). */
export const WMM2025_START = new Date('2024-11-13T03:00:00.000Z')
export const WMM2025_END = new Date('2029-11-13T03:00:00.000Z')

// Building a timed model costs far more than evaluating it: keep a few, keyed by the instant.
const MODEL_CACHE_SIZE = 16
const modelCache = new Map<number, GeomagnetismModel>()

function timedModel(date: Date): GeomagnetismModel {
  const key = date.getTime()
  let model = modelCache.get(key)
  if (!model) {
    model = geomagnetism.model(date)
    if (modelCache.size >= MODEL_CACHE_SIZE) {
      const oldest = modelCache.keys().next().value
      if (oldest !== undefined) modelCache.delete(oldest)
    }
    modelCache.set(key, model)
  }
  return model
}

/**
 * East-positive magnetic declination (variation) in degrees from the World Magnetic Model WMM2025
 * (npm geomagnetism) at a position, elevation and date. A date outside WMM2025 is a WindValidationError.
 */
export function magneticDeclinationDeg(query: DeclinationQuery): number {
  const issues: ValidationIssue[] = []
  const q = (typeof query === 'object' && query !== null ? query : {}) as Partial<DeclinationQuery>
  const { latDeg, lonDeg, elevationM, date } = q
  if (typeof latDeg !== 'number' || !Number.isFinite(latDeg) || Math.abs(latDeg) > 90) {
    issues.push({ field: 'latDeg', message: `latitude must be from -90 to 90 degrees, got ${describeValue(latDeg)}` })
  }
  if (typeof lonDeg !== 'number' || !Number.isFinite(lonDeg) || Math.abs(lonDeg) > 360) {
    issues.push({ field: 'lonDeg', message: `longitude must be from -360 to 360 degrees, got ${describeValue(lonDeg)}` })
  }
  // WMM2025 is specified from 1 km below to 850 km above the ellipsoid.
  if (typeof elevationM !== 'number' || !Number.isFinite(elevationM) || elevationM < -1000 || elevationM > 850_000) {
    issues.push({ field: 'elevationM', message: `height must be from -1000 to 850000 m for the magnetic model, got ${describeValue(elevationM)}` })
  }
  if (!(date instanceof Date) || Number.isNaN(date.getTime())) {
    issues.push({ field: 'date', message: 'a valid date is needed for the magnetic model' })
  }
  else if (date < WMM2025_START || date > WMM2025_END) {
    issues.push({
      field: 'date',
      message: `${date.toISOString().slice(0, 10)} is outside the World Magnetic Model WMM2025, valid from 2024-11-13 to 2029-11-13; give the magnetic heading instead`,
    })
  }
  if (issues.length) throw new WindValidationError(issues)
  // geomagnetism takes the height in km; above sea level is used for above the ellipsoid (tens of metres apart).
  return timedModel(date as Date).point([latDeg as number, lonDeg as number, (elevationM as number) / 1000]).decl
}

/** Magnetic heading (0, 360] from a true heading and an east-positive declination: magnetic = true - east. */
export function magneticFromTrue(trueHeadingDeg: number, declinationEastDeg: number): number {
  if (typeof trueHeadingDeg !== 'number' || !Number.isFinite(trueHeadingDeg)
    || typeof declinationEastDeg !== 'number' || !Number.isFinite(declinationEastDeg)) {
    throw new WindValidationError([{ field: 'trueHeadingDeg', message: 'true heading and declination must be numbers' }])
  }
  return normaliseHeadingDeg(trueHeadingDeg - declinationEastDeg)
}

/** True heading (0, 360] from a magnetic heading and an east-positive declination. */
export function trueFromMagnetic(magneticHeadingDeg: number, declinationEastDeg: number): number {
  if (typeof magneticHeadingDeg !== 'number' || !Number.isFinite(magneticHeadingDeg)
    || typeof declinationEastDeg !== 'number' || !Number.isFinite(declinationEastDeg)) {
    throw new WindValidationError([{ field: 'magneticHeadingDeg', message: 'magnetic heading and declination must be numbers' }])
  }
  return normaliseHeadingDeg(magneticHeadingDeg + declinationEastDeg)
}
