import { pressureToHeightM } from './atmosphere'
import { describeValue, WindValidationError } from './errors'
import { designatorHeadingDeg } from './runway'
import { KMH_PER_KT, M_PER_FT, MPS_PER_KT } from '../units'
import { windToUV } from './vector'
import { normaliseHeadingDeg } from './angles'
import type {
  HeightReference, NormalisedLevel, RunwayEndInput, ShearClassBoundsKtPer100ft, ValidationIssue, WindWarning,
} from './types'

/** A level this close to the ground counts as the surface level (product rule, issue 3). */
export const SURFACE_LEVEL_MAX_AGL_M = 30
export const MAX_SPEED_KT = 250
export const MAX_HEIGHT_AGL_M = 20000
export const MAX_LEVELS = 5000
export const MAX_RUNWAY_ENDS = 64

/** Light 0-4, moderate 5-8, strong 9-12, severe above 12 kt per 100 ft (ICAO Circular 186 / Doc 9817, from memory). */
export const DEFAULT_SHEAR_CLASS_BOUNDS_KT_PER_100FT: Readonly<ShearClassBoundsKtPer100ft> = Object.freeze({
  lightMaxKtPer100ft: 4,
  moderateMaxKtPer100ft: 8,
  strongMaxKtPer100ft: 12,
})

// Heights closer than this are the same height (well below any instrument's resolution).
const SAME_HEIGHT_M = 0.01
// Winds closer than this in u and v are the same wind (rounding of converted units).
const SAME_WIND_KT = 0.005
// Rounding of unit conversions must not push a level at ground level underground.
const GROUND_TOLERANCE_M = 1e-6

export interface NormalisedProfile {
  levels: NormalisedLevel[]
  runwayEnds: RunwayEndInput[]
  bounds: ShearClassBoundsKtPer100ft
  warnings: WindWarning[]
}

const isObject = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x)
const isFiniteNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x)
const present = (x: unknown): boolean => x !== undefined && x !== null

function pickOne(level: Record<string, unknown>, keys: readonly string[]): string[] {
  const found: string[] = []
  for (const k of keys) if (present(level[k])) found.push(k)
  return found
}

const HEIGHT_KEYS = ['heightM', 'heightFt', 'pressureHpa'] as const
const SPEED_KEYS = ['speedKt', 'speedMps', 'speedKmh'] as const
const GUST_KEYS = ['gustKt', 'gustMps', 'gustKmh'] as const
const KT_PER_UNIT: Record<string, number> = {
  speedKt: 1, speedMps: 1 / MPS_PER_KT, speedKmh: 1 / KMH_PER_KT,
  gustKt: 1, gustMps: 1 / MPS_PER_KT, gustKmh: 1 / KMH_PER_KT,
}

function readSpeedKt(level: Record<string, unknown>, keys: readonly string[], prefix: string, index: number,
  issues: ValidationIssue[], required: boolean): number | undefined {
  const found = pickOne(level, keys)
  if (found.length === 0) {
    if (required) issues.push({ index, field: `${prefix}.speedKt`, message: 'a speed is needed (speedKt, speedMps or speedKmh)' })
    return undefined
  }
  if (found.length > 1) {
    issues.push({ index, field: `${prefix}.${found[1]}`, message: `give one ${required ? 'speed' : 'gust'} field, not ${found.join(' and ')}` })
    return undefined
  }
  const key = found[0]!
  const raw = level[key]
  if (!isFiniteNumber(raw) || raw < 0) {
    issues.push({ index, field: `${prefix}.${key}`, message: `must be a number of 0 or more, got ${describeValue(raw)}` })
    return undefined
  }
  const kt = raw * KT_PER_UNIT[key]!
  if (kt > MAX_SPEED_KT + 1e-9) {
    issues.push({ index, field: `${prefix}.${key}`, message: `${raw} is more than ${MAX_SPEED_KT} kt` })
    return undefined
  }
  return kt
}

/**
 * Validates a profile and returns its levels in knots and metres AGL, sorted by height, with equal heights of the
 * same wind merged. Collects every problem and throws one WindValidationError listing them all.
 */
export function normaliseProfile(input: unknown): NormalisedProfile {
  const issues: ValidationIssue[] = []
  const warnings: WindWarning[] = []
  if (!isObject(input)) {
    throw new WindValidationError([{ field: 'input', message: `a profile object is needed, got ${describeValue(input)}` }])
  }
  const reference = input.heightReference as HeightReference
  if (reference !== 'AGL' && reference !== 'MSL') {
    issues.push({ field: 'heightReference', message: `must be "AGL" or "MSL", got ${describeValue(input.heightReference)}` })
  }
  let elevationM: number | undefined
  if (present(input.elevationM)) {
    if (!isFiniteNumber(input.elevationM) || input.elevationM < -500 || input.elevationM > 9000) {
      issues.push({ field: 'elevationM', message: `airfield elevation must be from -500 to 9000 m, got ${describeValue(input.elevationM)}` })
    }
    else {
      elevationM = input.elevationM
    }
  }

  const rawLevels = input.levels
  const levels: NormalisedLevel[] = []
  let usedPressure = false
  if (!Array.isArray(rawLevels)) {
    issues.push({ field: 'levels', message: 'a list of levels is needed' })
  }
  else if (rawLevels.length < 2) {
    issues.push({ field: 'levels', message: `at least two levels are needed, got ${rawLevels.length}` })
  }
  else if (rawLevels.length > MAX_LEVELS) {
    issues.push({ field: 'levels', message: `at most ${MAX_LEVELS} levels, got ${rawLevels.length}` })
  }
  else {
    for (let i = 0; i < rawLevels.length; i++) {
      const level: unknown = rawLevels[i]
      const prefix = `levels[${i}]`
      if (!isObject(level)) {
        issues.push({ index: i, field: prefix, message: `a level object is needed, got ${describeValue(level)}` })
        continue
      }
      const before = issues.length

      // Height, converted to metres above the ground.
      let heightAglM: number | undefined
      const heightKeys = pickOne(level, HEIGHT_KEYS)
      if (heightKeys.length !== 1) {
        issues.push({
          index: i,
          field: `${prefix}.heightM`,
          message: heightKeys.length === 0
            ? 'a height is needed (heightM, heightFt or pressureHpa)'
            : `give one height field, not ${heightKeys.join(' and ')}`,
        })
      }
      else {
        const key = heightKeys[0]!
        const raw = level[key]
        if (!isFiniteNumber(raw)) {
          issues.push({ index: i, field: `${prefix}.${key}`, message: `must be a number, got ${describeValue(raw)}` })
        }
        else if (key === 'pressureHpa') {
          usedPressure = true
          if (raw <= 0 || raw > 1100) {
            issues.push({ index: i, field: `${prefix}.pressureHpa`, message: `must be from above 0 to 1100 hPa, got ${raw}` })
          }
          else if (elevationM === undefined) {
            issues.push({ index: i, field: `${prefix}.pressureHpa`, message: 'a pressure level needs the airfield elevation (elevationM)' })
          }
          else {
            heightAglM = pressureToHeightM(raw) - elevationM
          }
        }
        else {
          const metres = key === 'heightFt' ? raw * M_PER_FT : raw
          if (reference === 'MSL') {
            if (elevationM === undefined) {
              issues.push({ index: i, field: `${prefix}.${key}`, message: 'heights above mean sea level need the airfield elevation (elevationM)' })
            }
            else {
              heightAglM = metres - elevationM
            }
          }
          else {
            heightAglM = metres
          }
        }
        if (heightAglM !== undefined) {
          if (heightAglM < -GROUND_TOLERANCE_M) {
            issues.push({ index: i, field: `${prefix}.${key}`, message: `is below the ground (${heightAglM.toFixed(1)} m above ground level after conversion)` })
            heightAglM = undefined
          }
          else if (heightAglM >= MAX_HEIGHT_AGL_M) {
            issues.push({ index: i, field: `${prefix}.${key}`, message: `must be below 20 km above ground level (${heightAglM.toFixed(0)} m after conversion)` })
            heightAglM = undefined
          }
          else if (heightAglM < 0) {
            heightAglM = 0
          }
        }
      }

      const speedKt = readSpeedKt(level, SPEED_KEYS, prefix, i, issues, true)
      const gustKt = readSpeedKt(level, GUST_KEYS, prefix, i, issues, false)
      if (gustKt !== undefined && speedKt !== undefined && gustKt < speedKt) {
        issues.push({ index: i, field: `${prefix}.gustKt`, message: 'a gust cannot be lower than the mean speed' })
      }

      // Direction matters only when the air moves.
      let directionDeg = 0
      if (speedKt !== undefined && speedKt > 0) {
        const raw = level.directionDeg
        if (!isFiniteNumber(raw) || raw < 0 || raw > 360) {
          issues.push({ index: i, field: `${prefix}.directionDeg`, message: `must be from 0 to 360 degrees, got ${describeValue(raw)}` })
        }
        else {
          directionDeg = normaliseHeadingDeg(raw)
        }
      }

      if (issues.length === before && heightAglM !== undefined && speedKt !== undefined) {
        const uv = windToUV(directionDeg, speedKt)
        const out: NormalisedLevel = { heightAglM, directionDeg, speedKt, uKt: uv.u, vKt: uv.v, sourceIndex: i }
        if (gustKt !== undefined) out.gustKt = gustKt
        levels.push(out)
      }
    }
  }

  const runwayEnds = readRunwayEnds(input.runwayEnds, issues)
  const bounds = readBounds(input.shearClassBoundsKtPer100ft, issues)

  if (issues.length) throw new WindValidationError(issues)

  levels.sort((a, b) => a.heightAglM - b.heightAglM || a.sourceIndex - b.sourceIndex)
  const merged = mergeEqualHeights(levels, issues, warnings)
  if (!issues.length && merged.length < 2) {
    issues.push({ field: 'levels', message: 'at least two levels at different heights are needed' })
  }
  // A gust belongs to the surface level only.
  for (let k = 0; k < merged.length; k++) {
    const level = merged[k]!
    if (level.gustKt !== undefined && (k > 0 || level.heightAglM > SURFACE_LEVEL_MAX_AGL_M)) {
      issues.push({
        index: level.sourceIndex,
        field: `levels[${level.sourceIndex}].gustKt`,
        message: `a gust is allowed only on the surface level (the lowest, within ${SURFACE_LEVEL_MAX_AGL_M} m of the ground)`,
      })
    }
  }
  if (issues.length) throw new WindValidationError(issues)
  if (usedPressure) {
    warnings.push({ code: 'standard-atmosphere', message: 'Pressure levels were placed at their ICAO standard atmosphere height; the real height differs with temperature and QNH.' })
  }
  return { levels: merged, runwayEnds, bounds, warnings }
}

function mergeEqualHeights(sorted: NormalisedLevel[], issues: ValidationIssue[], warnings: WindWarning[]): NormalisedLevel[] {
  const out: NormalisedLevel[] = []
  for (const level of sorted) {
    const last = out[out.length - 1]
    if (last && level.heightAglM - last.heightAglM < SAME_HEIGHT_M) {
      const same = Math.abs(level.uKt - last.uKt) <= SAME_WIND_KT && Math.abs(level.vKt - last.vKt) <= SAME_WIND_KT
        && (level.gustKt ?? -1) === (last.gustKt ?? -1)
      if (same) {
        warnings.push({
          code: 'levels-merged',
          message: `Levels ${last.sourceIndex} and ${level.sourceIndex} are both at ${last.heightAglM.toFixed(1)} m above ground with the same wind: kept once.`,
          indices: [last.sourceIndex, level.sourceIndex],
        })
      }
      else {
        issues.push({
          index: level.sourceIndex,
          field: `levels[${level.sourceIndex}]`,
          message: `levels ${last.sourceIndex} and ${level.sourceIndex} are both at ${last.heightAglM.toFixed(1)} m above ground with different winds`,
        })
      }
      continue
    }
    out.push(level)
  }
  return out
}

function readRunwayEnds(raw: unknown, issues: ValidationIssue[]): RunwayEndInput[] {
  if (!present(raw)) return []
  if (!Array.isArray(raw)) {
    issues.push({ field: 'runwayEnds', message: 'must be a list of runway ends' })
    return []
  }
  if (raw.length > MAX_RUNWAY_ENDS) {
    issues.push({ field: 'runwayEnds', message: `at most ${MAX_RUNWAY_ENDS} runway ends` })
    return []
  }
  const out: RunwayEndInput[] = []
  for (let i = 0; i < raw.length; i++) {
    const end: unknown = raw[i]
    const prefix = `runwayEnds[${i}]`
    if (!isObject(end)) {
      issues.push({ index: i, field: prefix, message: 'a runway end object is needed' })
      continue
    }
    const before = issues.length
    const designator = end.designator
    if (typeof designator !== 'string' || designatorHeadingDeg(designator) === null) {
      issues.push({ index: i, field: `${prefix}.designator`, message: `${describeValue(designator)} is not a runway designator (01 to 36, optionally L, C or R)` })
    }
    const trueHeadingDeg = end.trueHeadingDeg
    if (!isFiniteNumber(trueHeadingDeg) || trueHeadingDeg < 0 || trueHeadingDeg > 360) {
      issues.push({ index: i, field: `${prefix}.trueHeadingDeg`, message: `must be from 0 to 360 degrees, got ${describeValue(trueHeadingDeg)}` })
    }
    const magneticHeadingDeg = end.magneticHeadingDeg
    if (present(magneticHeadingDeg) && (!isFiniteNumber(magneticHeadingDeg) || magneticHeadingDeg < 0 || magneticHeadingDeg > 360)) {
      issues.push({ index: i, field: `${prefix}.magneticHeadingDeg`, message: `must be from 0 to 360 degrees, got ${describeValue(magneticHeadingDeg)}` })
    }
    if (issues.length === before) {
      const ok: RunwayEndInput = { designator: (designator as string).trim().toUpperCase(), trueHeadingDeg: normaliseHeadingDeg(trueHeadingDeg as number) }
      if (present(magneticHeadingDeg)) ok.magneticHeadingDeg = normaliseHeadingDeg(magneticHeadingDeg as number)
      out.push(ok)
    }
  }
  return out
}

function readBounds(raw: unknown, issues: ValidationIssue[]): ShearClassBoundsKtPer100ft {
  const bounds = { ...DEFAULT_SHEAR_CLASS_BOUNDS_KT_PER_100FT }
  if (!present(raw)) return bounds
  if (!isObject(raw)) {
    issues.push({ field: 'shearClassBoundsKtPer100ft', message: 'must be an object of class bounds' })
    return bounds
  }
  for (const key of ['lightMaxKtPer100ft', 'moderateMaxKtPer100ft', 'strongMaxKtPer100ft'] as const) {
    const value = raw[key]
    if (!present(value)) continue
    if (!isFiniteNumber(value) || value <= 0 || value > 1000) {
      issues.push({ field: `shearClassBoundsKtPer100ft.${key}`, message: `must be a positive number, got ${describeValue(value)}` })
    }
    else {
      bounds[key] = value
    }
  }
  if (!(bounds.lightMaxKtPer100ft < bounds.moderateMaxKtPer100ft && bounds.moderateMaxKtPer100ft < bounds.strongMaxKtPer100ft)) {
    issues.push({ field: 'shearClassBoundsKtPer100ft', message: 'the bounds must increase: light < moderate < strong' })
  }
  return bounds
}
