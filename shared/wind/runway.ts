import { degToRad, normaliseHeadingDeg, signedAngleDiffDeg } from './angles'
import { WindValidationError, describeValue } from './errors'
import type { CrosswindSide, DesignatorCheck, RunwayComponents } from './types'

/** Crosswinds smaller than this are reported as from neither side (numerical noise, not a wind). */
const SIDE_EPSILON_KT = 1e-6

/** Designator mismatch threshold in degrees (more than this is reported). */
export const DESIGNATOR_TOLERANCE_DEG = 10

export function crosswindSideOf(crosswindKt: number): CrosswindSide {
  if (crosswindKt > SIDE_EPSILON_KT) return 'right'
  if (crosswindKt < -SIDE_EPSILON_KT) return 'left'
  return 'none'
}

/** Unchecked core, for the engine's own loops. */
export function componentsOf(directionDeg: number, speedKt: number, headingDeg: number): RunwayComponents {
  const theta = degToRad(directionDeg - headingDeg)
  const crosswindKt = speedKt * Math.sin(theta)
  return { headwindKt: speedKt * Math.cos(theta), crosswindKt, crosswindSide: crosswindSideOf(crosswindKt) }
}

function requireFinite(value: unknown, field: string, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < min || value > max) {
    throw new WindValidationError([{ field, message: `must be a number from ${min} to ${max}, got ${describeValue(value)}` }])
  }
  return value
}

/**
 * Headwind (negative = tailwind) and crosswind (positive = from the right) of a wind from `directionDeg`
 * at `speedKt` on a runway of heading `headingDeg`; direction and heading both true or both magnetic.
 */
export function runwayComponents(directionDeg: number, speedKt: number, headingDeg: number): RunwayComponents {
  requireFinite(directionDeg, 'directionDeg', 0, 360)
  requireFinite(speedKt, 'speedKt', 0, Number.MAX_VALUE)
  requireFinite(headingDeg, 'headingDeg', 0, 360)
  return componentsOf(directionDeg, speedKt, headingDeg)
}

const DESIGNATOR_RE = /^(\d{1,2})([LCR])?$/

/** Heading implied by a designator ("09L" -> 90, "36" -> 360), or null when it is not a runway designator. */
export function designatorHeadingDeg(designator: string): number | null {
  if (typeof designator !== 'string') return null
  const m = DESIGNATOR_RE.exec(designator.trim().toUpperCase())
  if (!m) return null
  const n = Number(m[1])
  return n >= 1 && n <= 36 ? n * 10 : null
}

/**
 * Compares a designator with the magnetic heading (designator = magnetic azimuth / 10, FAA AC 150/5340-1);
 * more than 10 degrees apart is a mismatch worth reporting.
 */
export function designatorMismatch(designator: string, magneticHeadingDeg: number): DesignatorCheck {
  const headingFromDesignator = designatorHeadingDeg(designator)
  if (headingFromDesignator === null) {
    throw new WindValidationError([{ field: 'designator', message: `${describeValue(designator)} is not a runway designator (01 to 36, optionally L, C or R)` }])
  }
  requireFinite(magneticHeadingDeg, 'magneticHeadingDeg', 0, 360)
  const differenceDeg = Math.abs(signedAngleDiffDeg(headingFromDesignator, magneticHeadingDeg))
  return { designatorHeadingDeg: headingFromDesignator, differenceDeg, mismatch: differenceDeg > DESIGNATOR_TOLERANCE_DEG }
}

/** Heading of the opposite end of a runway, (0, 360]. */
export function reciprocalHeadingDeg(headingDeg: number): number {
  return normaliseHeadingDeg(headingDeg + 180)
}
