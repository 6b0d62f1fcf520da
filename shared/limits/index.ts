/**
 * Operator limits and how a profile's figures are held against them. Plain TypeScript: no database, no HTTP.
 * The safety office sets the numbers (stored per organisation and per airfield); these are only defaults.
 */
import type { ProfileAnalysis } from '../wind'

export interface Limits {
  /** Maximum crosswind, checked against the mean and the gust. */
  maxCrosswindKt: number
  /** Maximum tailwind, checked against the mean and the gust. */
  maxTailwindKt: number
  /** Maximum vertical shear of any 30 m layer in the lowest 600 m. */
  maxLayerShearKtPer100ft: number
  /** Maximum magnitude of the vector wind difference from the surface to 600 m. */
  maxVectorDiff600mKt: number
  /** Maximum airspeed loss a steady aircraft meets in the final approach or initial climb corridor. */
  maxAirspeedLossKt: number
  /** Largest 1 km averaged F-factor (horizontal wind only) along the arrival or departure path. */
  maxFFactor: number
  /** A figure within this share of its limit is reported as near the limit. */
  nearLimitMarginPct: number
}

/**
 * Defaults, each with where it comes from. Crosswind 20 kt: the least a transport aeroplane must demonstrate
 * (14 CFR 25.237, from memory). Tailwind 10 kt: the usual certified tailwind limit (NLR-TP-2001-003).
 * Layer shear 8 kt per 100 ft: upper bound of "moderate" (ICAO Circular 186 table, from memory).
 * Vector difference 0-600 m 30 kt and airspeed loss 15 kt: airport wind shear alerting practice
 * (15 kt headwind change, following ICAO Annex 3); 30 kt over 600 m is a conservative Veerline default.
 */
export const DEFAULT_LIMITS: Limits = {
  maxCrosswindKt: 20,
  maxTailwindKt: 10,
  maxLayerShearKtPer100ft: 8,
  maxVectorDiff600mKt: 30,
  maxAirspeedLossKt: 15,
  // 0.1: the 1 km averaged F-factor from which airborne wind shear systems advise (Proctor, Hinton and Bowles 2000,
  // "A Windshear Hazard Index", on its hazard threshold; "an F-Factor ranging between 0.1-0.15 or more ... used to
  // provide windshear advisories", Aerocrew News 2024, seen; the 1 km averaging from memory).
  maxFFactor: 0.1,
  nearLimitMarginPct: 10,
}

/** Sensible ranges the safety office may set, with units, for validation messages. */
/** One alert a limit change raises or clears, named by airfield, runway end, kind and profile version. */
export interface LimitEffectItem {
  event: 'raised' | 'cleared'
  airfieldCode: string
  designator: string
  kind: string
  profileId: number
  value: number
  limitValue: number
  unit: string
  message: string
}

export const LIMIT_RANGES: Record<keyof Limits, { min: number, max: number, unit: string, label: string }> = {
  maxCrosswindKt: { min: 0, max: 60, unit: 'kt', label: 'Maximum crosswind' },
  maxTailwindKt: { min: 0, max: 30, unit: 'kt', label: 'Maximum tailwind' },
  maxLayerShearKtPer100ft: { min: 1, max: 30, unit: 'kt/100 ft', label: 'Maximum layer shear' },
  maxVectorDiff600mKt: { min: 5, max: 100, unit: 'kt', label: 'Maximum vector difference, surface to 600 m' },
  maxAirspeedLossKt: { min: 5, max: 60, unit: 'kt', label: 'Maximum airspeed loss along the path' },
  maxFFactor: { min: 0.03, max: 0.5, unit: '', label: 'Maximum F-factor (1 km average, no unit)' },
  nearLimitMarginPct: { min: 0, max: 50, unit: '%', label: 'Near-limit margin' },
}

export type LimitKind
  = | 'crosswind' | 'crosswind-gust' | 'tailwind' | 'tailwind-gust'
    | 'airspeed-loss-arrival' | 'airspeed-loss-departure'
    | 'layer-shear' | 'vector-difference'
    | 'f-factor-arrival' | 'f-factor-departure'
    | 'reported-wind-shear'

/** Runway wind shear reported in a coded report (WS Rnn, WS ALL RWY, WS LDG/TKOF RWYnn). */
export interface ReportedShear {
  allRunways: boolean
  runways: string[]
  groups: string[]
  observedAt: string | null
}

export interface LimitCheck {
  kind: LimitKind
  /** Runway end designator, or null for airfield-wide figures (layer shear, vector difference). */
  designator: string | null
  value: number
  limit: number
  unit: 'kt' | 'kt/100 ft' | 'F' | 'report'
  /** value - limit (positive when exceeded). */
  excess: number
  state: 'exceeded' | 'near' | 'within'
  /** Plain words: what crossed which limit by how much. */
  message: string
}

export const KIND_WORDS: Record<LimitKind, string> = {
  'crosswind': 'Crosswind',
  'crosswind-gust': 'Gust crosswind',
  'tailwind': 'Tailwind',
  'tailwind-gust': 'Gust tailwind',
  'airspeed-loss-arrival': 'Airspeed loss on arrival',
  'airspeed-loss-departure': 'Airspeed loss on departure',
  'layer-shear': 'Layer shear',
  'vector-difference': 'Vector wind difference surface to 600 m',
  'f-factor-arrival': 'F-factor (1 km, horizontal wind only) on arrival',
  'f-factor-departure': 'F-factor (1 km, horizontal wind only) on departure',
  'reported-wind-shear': 'Wind shear reported',
}

/** A limit figure with its unit, or alone when it has none ('0.1' for the F-factor). */
export const withUnit = (value: number | string, unit: string) => unit ? `${value} ${unit}` : `${value}`

/** A figure with its unit as a notice writes it: "23.4 kt", "9.1 kt/100 ft", "0.105" (the F-factor has no unit). */
export function figureText(value: number, unit: string): string {
  if (unit === 'F') return value.toFixed(3)
  if (unit === 'report') return value > 0 ? 'reported' : 'none'
  return `${value.toFixed(1)} ${unit}`
}

function check(kind: LimitKind, designator: string | null, value: number, limit: number, unit: LimitCheck['unit'],
  marginPct: number, where = ''): LimitCheck {
  const excess = value - limit
  const state = value > limit ? 'exceeded' : value >= limit * (1 - marginPct / 100) ? 'near' : 'within'
  const subject = `${KIND_WORDS[kind]}${designator ? ` runway ${designator}` : ''}${where}`
  // The F-factor is a plain number (FAA AC 00-54): written without a unit.
  const u = unit === 'F' ? '' : unit
  const v = figureText(value, unit)
  const lim = withUnit(limit, u)
  const message = state === 'exceeded'
    ? `${subject} ${v} exceeds the limit of ${lim} by ${figureText(excess, unit)}`
    : state === 'near'
      ? `${subject} ${v} is within ${marginPct}% of the limit of ${lim}`
      : `${subject} ${v} is within the limit of ${lim}`
  return { kind, designator, value, limit, unit, excess, state, message }
}

/**
 * Every check of one analysed profile against the limits (one limit set per runway end allowed through
 * `limitsFor`). Figures the profile cannot give (no surface level, short of 600 m) are left out, not invented.
 */
export function evaluateLimits(analysis: ProfileAnalysis, limits: Limits,
  limitsFor: (designator: string) => Limits = () => limits, reported: ReportedShear | null = null): LimitCheck[] {
  const checks: LimitCheck[] = []
  for (const end of analysis.runwayEnds) {
    const l = limitsFor(end.designator)
    const m = l.nearLimitMarginPct
    const s = end.surface
    if (s) {
      checks.push(check('crosswind', end.designator, Math.abs(s.crosswindKt), l.maxCrosswindKt, 'kt', m))
      if (s.gustCrosswindKt != null) checks.push(check('crosswind-gust', end.designator, Math.abs(s.gustCrosswindKt), l.maxCrosswindKt, 'kt', m))
      checks.push(check('tailwind', end.designator, Math.max(0, -s.headwindKt), l.maxTailwindKt, 'kt', m))
      if (s.gustHeadwindKt != null) checks.push(check('tailwind-gust', end.designator, Math.max(0, -s.gustHeadwindKt), l.maxTailwindKt, 'kt', m))
    }
    // The airspeed loss check covers the final approach / initial climb corridor (airport wind shear alerting
    // practice); the 0-600 m path figure stays information on the briefing.
    const nm = ` within ${analysis.paths.corridorNm} NM of the threshold`
    if (end.arrivalCorridor) checks.push(check('airspeed-loss-arrival', end.designator, end.arrivalCorridor.maxAirspeedLossKt, l.maxAirspeedLossKt, 'kt', m, nm))
    if (end.departureCorridor) checks.push(check('airspeed-loss-departure', end.designator, end.departureCorridor.maxAirspeedLossKt, l.maxAirspeedLossKt, 'kt', m, nm))
    const fa = end.fFactor.arrival
    const fd = end.fFactor.departure
    if (fa) checks.push(check('f-factor-arrival', end.designator, fa.maxF, l.maxFFactor, 'F', m, ` (${Math.round(fa.startHeightM)}-${Math.round(fa.endHeightM)} m)`))
    if (fd) checks.push(check('f-factor-departure', end.designator, fd.maxF, l.maxFFactor, 'F', m, ` (${Math.round(fd.startHeightM)}-${Math.round(fd.endHeightM)} m)`))
    if (reported && (reported.allRunways || reported.runways.includes(end.designator))) {
      const groups = reported.groups.filter(g => g === 'WS ALL RWY' || g.endsWith(end.designator)).join(', ')
      checks.push({
        kind: 'reported-wind-shear', designator: end.designator, value: 1, limit: 0, unit: 'report', excess: 1, state: 'exceeded',
        message: `Wind shear reported for runway ${end.designator} (${groups}${reported.observedAt ? `, report of ${reported.observedAt.slice(0, 16).replace('T', ' ')}Z` : ''})`,
      })
    }
  }
  const m = limits.nearLimitMarginPct
  const strongest = analysis.shear.strongestLayer
  if (strongest) {
    checks.push(check('layer-shear', null, strongest.shearKtPer100ft, limits.maxLayerShearKtPer100ft, 'kt/100 ft', m,
      ` (${Math.round(strongest.baseM)}-${Math.round(strongest.topM)} m)`))
  }
  const diff = analysis.shear.surfaceTo600m
  if (diff) checks.push(check('vector-difference', null, diff.vectorDiffKt, limits.maxVectorDiff600mKt, 'kt', m))
  return checks
}

export function exceedances(checks: LimitCheck[]) {
  return checks.filter(c => c.state === 'exceeded')
}
