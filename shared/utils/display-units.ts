// How figures are shown to a reader: conversions for display only (the engine works in kt and metres).
import { M_PER_FT, MPS_PER_KT } from '../units'

/** Exact: 1 kt = 1852/3600 m/s (international nautical mile of 1852 m); the factor lives in shared/units.ts. */
export const MPS_PER_KT_EXACT = MPS_PER_KT

/** Exact: 1 ft = 0.3048 m (international yard and pound, 1959); the factor lives in shared/units.ts. */
export const M_PER_FT_EXACT = M_PER_FT

export type SpeedUnit = 'kt' | 'mps'
export type HeightUnit = 'ft' | 'm'
export type HeadingRef = 'true' | 'magnetic'

export type DisplayPreferences = { speedUnit: SpeedUnit, heightUnit: HeightUnit, headingRef: HeadingRef }
export const DEFAULT_PREFERENCES: DisplayPreferences = { speedUnit: 'kt', heightUnit: 'ft', headingRef: 'true' }

export const SPEED_UNIT_LABEL: Record<SpeedUnit, string> = { kt: 'kt', mps: 'm/s' }
export const HEIGHT_UNIT_LABEL: Record<HeightUnit, string> = { ft: 'ft', m: 'm' }

export function speedFromKt(speedKt: number, unit: SpeedUnit): number {
  return unit === 'kt' ? speedKt : speedKt * MPS_PER_KT_EXACT
}

export function speedToKt(speed: number, unit: SpeedUnit): number {
  return unit === 'kt' ? speed : speed / MPS_PER_KT_EXACT
}

export function heightFromM(heightM: number, unit: HeightUnit): number {
  return unit === 'm' ? heightM : heightM / M_PER_FT_EXACT
}

export function heightToM(height: number, unit: HeightUnit): number {
  return unit === 'm' ? height : height * M_PER_FT_EXACT
}

/** A speed for reading: whole knots, or m/s to one decimal. */
export function formatSpeed(speedKt: number, unit: SpeedUnit, withUnit = true): string {
  const value = speedFromKt(speedKt, unit)
  const text = unit === 'kt' ? String(Math.round(value)) : value.toFixed(1)
  return withUnit ? `${normaliseZero(text)} ${SPEED_UNIT_LABEL[unit]}` : normaliseZero(text)
}

/** A height for reading: whole feet or whole metres. */
export function formatHeight(heightM: number, unit: HeightUnit, withUnit = true): string {
  const text = normaliseZero(String(Math.round(heightFromM(heightM, unit))))
  return withUnit ? `${text} ${HEIGHT_UNIT_LABEL[unit]}` : text
}

/** A heading or wind direction in the reader's reference. Magnetic = true - east declination. */
export function headingFor(trueDeg: number, declinationDeg: number, ref: HeadingRef): number {
  if (ref === 'true') return normaliseDeg(trueDeg)
  return normaliseDeg(trueDeg - declinationDeg)
}

/** Three-digit heading with its reference mark, e.g. "047°T", "360°M". Calm (0) stays "000". */
export function formatHeading(trueDeg: number, declinationDeg: number, ref: HeadingRef, calm = false): string {
  if (calm) return '000'
  const deg = Math.round(headingFor(trueDeg, declinationDeg, ref)) % 360 || 360
  return `${String(deg).padStart(3, '0')}°${ref === 'true' ? 'T' : 'M'}`
}

/** Headwind or tailwind in words, e.g. "12 kt headwind", "4 kt tailwind". */
export function formatHeadTail(headwindKt: number, unit: SpeedUnit): string {
  if (Math.abs(speedFromKt(headwindKt, unit)) < (unit === 'kt' ? 0.5 : 0.05)) return `${formatSpeed(0, unit)} head/tail`
  return `${formatSpeed(Math.abs(headwindKt), unit)} ${headwindKt >= 0 ? 'headwind' : 'tailwind'}`
}

/** Crosswind with its side, e.g. "7 kt from the left". */
export function formatCross(crosswindKt: number, unit: SpeedUnit): string {
  if (Math.abs(speedFromKt(crosswindKt, unit)) < (unit === 'kt' ? 0.5 : 0.05)) return `${formatSpeed(0, unit)} crosswind`
  return `${formatSpeed(Math.abs(crosswindKt), unit)} from the ${crosswindKt > 0 ? 'right' : 'left'}`
}

function normaliseDeg(deg: number): number {
  const d = deg % 360
  return d < 0 ? d + 360 : d
}

function normaliseZero(text: string): string {
  return text === '-0' ? '0' : text === '-0.0' ? '0.0' : text
}
