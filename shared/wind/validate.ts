import {
  heightAboveReferenceM, heightToPressureHpa, hypsometricThicknessM, pressureAtElevationHpa, pressureToHeightM,
} from './atmosphere'
import { describeValue, WindValidationError } from './errors'
import { designatorHeadingDeg } from './runway'
import { KMH_PER_KT, M_PER_FT, MPS_PER_KT } from '../units'
import { windToUV } from './vector'
import { normaliseHeadingDeg } from './angles'
import type {
  HeightReference, NormalisedLevel, PathGeometry, PathSettings, RunwayEndInput, ShearClassBoundsKtPer100ft, ValidationIssue, WindWarning,
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
/** An MSL level this far below the elevation (a height rounded to whole feet) is the surface, with a warning. */
export const SURFACE_BELOW_ELEVATION_M = 1
const QNH_RANGE_HPA = { min: 850, max: 1100 }
const STATION_PRESSURE_RANGE_HPA = { min: 300, max: 1100 }
const MIN_TEMPERATURE_C = -90
const MAX_TEMPERATURE_C = 60
const ZERO_C_K = 273.15
const M_PER_NM = 1852

/**
 * Corridor and path geometry defaults: 3 NM final approach / initial climb corridor (airport wind shear alerting
 * practice, common practice); a 3.0° glide path at 140 kt and a 6.0° climb at 160 kt true airspeed (Veerline
 * defaults, set per airfield).
 */
export const DEFAULT_PATH_SETTINGS: Readonly<PathSettings> = Object.freeze({
  corridorNm: 3,
  arrivalGlidePathDeg: 3,
  arrivalTrueAirspeedKt: 140,
  departureClimbDeg: 6,
  departureTrueAirspeedKt: 160,
})
/** The accepted range of each path setting (engine input and the airfield's stored settings). */
export const PATH_RANGES: Record<keyof PathSettings, { min: number, max: number, unit: string }> = {
  corridorNm: { min: 0.5, max: 10, unit: 'NM' },
  arrivalGlidePathDeg: { min: 1, max: 8, unit: '°' },
  arrivalTrueAirspeedKt: { min: 40, max: 250, unit: 'kt' },
  departureClimbDeg: { min: 1, max: 20, unit: '°' },
  departureTrueAirspeedKt: { min: 40, max: 300, unit: 'kt' },
}

export interface NormalisedProfile {
  levels: NormalisedLevel[]
  runwayEnds: RunwayEndInput[]
  bounds: ShearClassBoundsKtPer100ft
  paths: PathGeometry
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

const LENGTH_HEIGHT_KEYS = ['heightM', 'heightFt'] as const
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

  const qnhHpa = readPressure(input, 'qnhHpa', 'QNH', QNH_RANGE_HPA, issues)
  const surfacePressureHpa = readPressure(input, 'surfacePressureHpa', 'station pressure', STATION_PRESSURE_RANGE_HPA, issues)

  const rawLevels = input.levels
  const levels: NormalisedLevel[] = []
  // Levels placed by pressure wait until every filed height is known (the surface temperature may be among them).
  const pending: { level: NormalisedLevel, pressureHpa: number, field: string }[] = []
  const belowElevation: number[] = []
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

      // Height, converted to metres above the ground; a filed height wins over a pressure given with it.
      let heightAglM: number | undefined
      let pressureHpa: number | undefined
      let heightField = `${prefix}.heightM`
      const heightKeys = pickOne(level, LENGTH_HEIGHT_KEYS)
      const hasPressure = present(level.pressureHpa)
      if (heightKeys.length > 1) {
        issues.push({ index: i, field: `${prefix}.${heightKeys[1]}`, message: `give one height field, not ${heightKeys.join(' and ')}` })
      }
      else if (heightKeys.length === 0 && !hasPressure) {
        issues.push({ index: i, field: `${prefix}.heightM`, message: 'a height is needed (heightM, heightFt or pressureHpa)' })
      }
      else if (heightKeys.length === 0) {
        const raw = level.pressureHpa
        heightField = `${prefix}.pressureHpa`
        if (!isFiniteNumber(raw) || raw <= 0 || raw > 1100) {
          issues.push({ index: i, field: heightField, message: `must be from above 0 to 1100 hPa, got ${describeValue(raw)}` })
        }
        else if (elevationM === undefined && surfacePressureHpa === undefined) {
          issues.push({ index: i, field: heightField, message: 'a pressure level needs the airfield elevation (elevationM) or the station pressure (surfacePressureHpa)' })
        }
        else {
          pressureHpa = raw
        }
      }
      else {
        const key = heightKeys[0]!
        const raw = level[key]
        heightField = `${prefix}.${key}`
        if (!isFiniteNumber(raw)) {
          issues.push({ index: i, field: heightField, message: `must be a number, got ${describeValue(raw)}` })
        }
        else {
          const metres = key === 'heightFt' ? raw * M_PER_FT : raw
          if (reference === 'MSL') {
            if (elevationM === undefined) {
              issues.push({ index: i, field: heightField, message: 'heights above mean sea level need the airfield elevation (elevationM)' })
            }
            else {
              heightAglM = checkHeightAgl(metres - elevationM, true, i, heightField, issues, belowElevation)
            }
          }
          else {
            heightAglM = checkHeightAgl(metres, false, i, heightField, issues, belowElevation)
          }
        }
        if (hasPressure && !(isFiniteNumber(level.pressureHpa) && level.pressureHpa > 0 && level.pressureHpa <= 1100)) {
          issues.push({ index: i, field: `${prefix}.pressureHpa`, message: `must be from above 0 to 1100 hPa, got ${describeValue(level.pressureHpa)}` })
        }
      }

      let temperatureC: number | undefined
      if (present(level.temperatureC)) {
        const raw = level.temperatureC
        if (!isFiniteNumber(raw) || raw < MIN_TEMPERATURE_C || raw > MAX_TEMPERATURE_C) {
          issues.push({ index: i, field: `${prefix}.temperatureC`, message: `must be from ${MIN_TEMPERATURE_C} to ${MAX_TEMPERATURE_C} °C, got ${describeValue(raw)}` })
        }
        else {
          temperatureC = raw
        }
      }

      const speedKt = readSpeedKt(level, SPEED_KEYS, prefix, i, issues, true)
      const gustKt = readSpeedKt(level, GUST_KEYS, prefix, i, issues, false)
      if (gustKt !== undefined && speedKt !== undefined && gustKt < speedKt) {
        issues.push({ index: i, field: `${prefix}.gustKt`, message: 'a gust cannot be lower than the mean speed' })
      }

      // Direction matters only when the air moves: a gust on a calm mean keeps the direction filed for it.
      let directionDeg = 0
      if ((speedKt !== undefined && speedKt > 0) || (gustKt !== undefined && gustKt > 0)) {
        const raw = level.directionDeg
        if (!isFiniteNumber(raw) || raw < 0 || raw > 360) {
          issues.push({ index: i, field: `${prefix}.directionDeg`, message: `must be from 0 to 360 degrees, got ${describeValue(raw)}` })
        }
        else {
          directionDeg = normaliseHeadingDeg(raw)
        }
      }

      if (issues.length === before && speedKt !== undefined && (heightAglM !== undefined || pressureHpa !== undefined)) {
        const uv = windToUV(directionDeg, speedKt)
        const out: NormalisedLevel = { heightAglM: heightAglM ?? 0, directionDeg, speedKt, uKt: uv.u, vKt: uv.v, heightFrom: 'filed', sourceIndex: i }
        if (gustKt !== undefined) out.gustKt = gustKt
        if (temperatureC !== undefined) out.temperatureC = temperatureC
        if (pressureHpa !== undefined) pending.push({ level: out, pressureHpa, field: heightField })
        else levels.push(out)
      }
    }
  }

  const standardIndices = placePressureLevels(pending, levels, { elevationM, qnhHpa, surfacePressureHpa }, issues, belowElevation)
  if (belowElevation.length) {
    warnings.push({
      code: 'surface-below-elevation',
      message: `Level${belowElevation.length > 1 ? 's' : ''} ${belowElevation.join(', ')} ${belowElevation.length > 1 ? 'are' : 'is'} up to ${SURFACE_BELOW_ELEVATION_M} m below the airfield elevation (rounding): taken as the surface.`,
      indices: belowElevation,
    })
  }

  const runwayEnds = readRunwayEnds(input.runwayEnds, issues)
  const bounds = readBounds(input.shearClassBoundsKtPer100ft, issues)
  const paths = readPaths(input.paths, issues)

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
  if (standardIndices.length) {
    warnings.push({
      code: 'standard-atmosphere',
      message: 'Heights from the standard atmosphere: no QNH given. Pressure levels sit where they would on a standard day; with the QNH (or station pressure) and temperatures they are placed as the day is.',
      indices: standardIndices,
    })
  }
  return { levels: merged, runwayEnds, bounds, paths, warnings }
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

function readPressure(input: Record<string, unknown>, key: string, words: string, range: { min: number, max: number },
  issues: ValidationIssue[]): number | undefined {
  const raw = input[key]
  if (!present(raw)) return undefined
  if (!isFiniteNumber(raw) || raw < range.min || raw > range.max) {
    issues.push({ field: key, message: `${words} must be from ${range.min} to ${range.max} hPa, got ${describeValue(raw)}` })
    return undefined
  }
  return raw
}

/** Checks a height above ground; MSL heights up to 1 m below the elevation count as the surface. */
function checkHeightAgl(heightAglM: number, fromSeaLevel: boolean, index: number, field: string,
  issues: ValidationIssue[], belowElevation: number[]): number | undefined {
  if (heightAglM < -GROUND_TOLERANCE_M) {
    if (fromSeaLevel && heightAglM >= -SURFACE_BELOW_ELEVATION_M - GROUND_TOLERANCE_M) {
      belowElevation.push(index)
      return 0
    }
    issues.push({ index, field, message: `is below the ground (${heightAglM.toFixed(1)} m above ground level after conversion)` })
    return undefined
  }
  if (heightAglM >= MAX_HEIGHT_AGL_M) {
    issues.push({ index, field, message: `must be below 20 km above ground level (${heightAglM.toFixed(0)} m after conversion)` })
    return undefined
  }
  return Math.max(0, heightAglM)
}

/**
 * Places levels given by pressure, from the ground up in order of falling pressure. Where a level and the one
 * below it (or the surface) have temperatures, the layer's thickness comes from the hypsometric equation; a level
 * without a temperature sits where an altimeter set to the station pressure (QFE) or the QNH shows it; with
 * neither, the ICAO standard atmosphere (the indices are returned for the warning).
 */
function placePressureLevels(pending: { level: NormalisedLevel, pressureHpa: number, field: string }[],
  levels: NormalisedLevel[], ref: { elevationM?: number, qnhHpa?: number, surfacePressureHpa?: number },
  issues: ValidationIssue[], belowElevation: number[]): number[] {
  const standard: number[] = []
  if (!pending.length) return standard
  const elevationM = ref.elevationM
  // The pressure at the ground and how it was found.
  let groundHpa: number
  let anchor: 'station-pressure' | 'qnh' | 'standard-atmosphere'
  if (ref.surfacePressureHpa !== undefined) {
    groundHpa = ref.surfacePressureHpa
    anchor = 'station-pressure'
  }
  else if (ref.qnhHpa !== undefined && elevationM !== undefined) {
    groundHpa = pressureAtElevationHpa(ref.qnhHpa, elevationM)
    anchor = 'qnh'
  }
  else {
    groundHpa = heightToPressureHpa(Math.max(0, elevationM ?? 0))
    anchor = 'standard-atmosphere'
  }
  // Above ground level from an altimeter-style reading with no temperature.
  const noTemperatureAglM = (p: number): number => anchor === 'station-pressure'
    ? heightAboveReferenceM(p, groundHpa)
    : anchor === 'qnh'
      ? heightAboveReferenceM(p, ref.qnhHpa!) - elevationM!
      : pressureToHeightM(p) - (elevationM ?? 0)
  // The surface temperature: a filed level at the surface that gives one.
  let surfaceTemperatureC: number | undefined
  for (const lv of levels) {
    if (lv.temperatureC !== undefined && lv.heightAglM <= SURFACE_LEVEL_MAX_AGL_M
      && (surfaceTemperatureC === undefined || lv.heightAglM === 0)) surfaceTemperatureC = lv.temperatureC
  }
  pending.sort((a, b) => b.pressureHpa - a.pressureHpa)
  let below = { pressureHpa: groundHpa, heightAglM: 0, temperatureC: surfaceTemperatureC }
  for (const item of pending) {
    const t = item.level.temperatureC
    let heightAglM: number
    if (t !== undefined) {
      const meanK = ZERO_C_K + (below.temperatureC === undefined ? t : (below.temperatureC + t) / 2)
      heightAglM = below.heightAglM + hypsometricThicknessM(below.pressureHpa, item.pressureHpa, meanK)
      item.level.heightFrom = 'hypsometric'
    }
    else {
      heightAglM = noTemperatureAglM(item.pressureHpa)
      item.level.heightFrom = anchor
    }
    if (anchor === 'standard-atmosphere') standard.push(item.level.sourceIndex)
    const checked = checkHeightAgl(heightAglM, true, item.level.sourceIndex, item.field, issues, belowElevation)
    if (checked === undefined) continue
    item.level.heightAglM = checked
    levels.push(item.level)
    below = { pressureHpa: item.pressureHpa, heightAglM: checked, temperatureC: t }
  }
  return standard.sort((a, b) => a - b)
}

function readPaths(raw: unknown, issues: ValidationIssue[]): PathGeometry {
  const settings: PathSettings = { ...DEFAULT_PATH_SETTINGS }
  if (present(raw)) {
    if (!isObject(raw)) {
      issues.push({ field: 'paths', message: 'must be an object of path settings' })
    }
    else {
      for (const key of Object.keys(PATH_RANGES) as (keyof PathSettings)[]) {
        const value = raw[key]
        if (!present(value)) continue
        const range = PATH_RANGES[key]
        if (!isFiniteNumber(value) || value < range.min || value > range.max) {
          issues.push({ field: `paths.${key}`, message: `must be from ${range.min} to ${range.max} ${range.unit}, got ${describeValue(value)}` })
        }
        else {
          settings[key] = value
        }
      }
    }
  }
  const corridorM = settings.corridorNm * M_PER_NM
  return {
    ...settings,
    arrivalCorridorTopM: corridorM * Math.tan((settings.arrivalGlidePathDeg * Math.PI) / 180),
    departureCorridorTopM: corridorM * Math.tan((settings.departureClimbDeg * Math.PI) / 180),
  }
}
