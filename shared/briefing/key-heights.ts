/**
 * Key heights of a briefing at round values of the reader's unit: SFC, 500, 1,000, 1,500 and 2,000 ft, or SFC, 150,
 * 300, 450 and 600 m. Each is interpolated at exactly that height (linear in u and v, as the engine's grid), never a
 * metre value converted to feet. Plain TypeScript.
 */
import { windAtHeightAglM } from '../wind/at-height'
import { componentsOf } from '../wind/runway'
import type { NormalisedLevel, RunwayComponents } from '../wind/types'
import { M_PER_FT } from '../units'

export type KeyHeightUnit = 'ft' | 'm'

/** The round heights above ground, in their own unit; 0 stands for the surface level (SFC). */
export const KEY_HEIGHTS: Record<KeyHeightUnit, readonly number[]> = {
  ft: [0, 500, 1000, 1500, 2000],
  m: [0, 150, 300, 450, 600],
}

export interface KeyHeightRow {
  /** "SFC", "500 ft", "1,000 ft", "150 m" … */
  label: string
  /** The round value in its own unit (0 for SFC). */
  value: number
  unit: KeyHeightUnit
  /** The height the wind is taken at, metres AGL (for SFC: the surface level's own height). */
  heightAglM: number
  /** The wind there, or null (see `reason`) when the profile does not reach it. */
  directionDeg: number | null
  speedKt: number | null
  gustKt: number | null
  components: (RunwayComponents & { designator: string, gustHeadwindKt: number | null, gustCrosswindKt: number | null })[]
  reason: string | null
}

export function keyHeightLabel(value: number, unit: KeyHeightUnit): string {
  return value === 0 ? 'SFC' : `${value.toLocaleString('en-GB')} ${unit}`
}

/**
 * The key heights for `unit` from the engine's normalised levels (sorted by height), its surface level (within 30 m
 * of the ground, or null) and the runway ends' true headings.
 */
export function keyHeights(levels: readonly NormalisedLevel[], surface: NormalisedLevel | null,
  ends: readonly { designator: string, trueHeadingDeg: number }[], unit: KeyHeightUnit): KeyHeightRow[] {
  const top = levels.length ? levels[levels.length - 1]!.heightAglM : 0
  return KEY_HEIGHTS[unit].map((value) => {
    const label = keyHeightLabel(value, unit)
    if (value === 0) {
      if (!surface) return empty(label, value, unit, 0, 'no surface level (within 30 m of the ground)')
      return row(label, value, unit, surface.heightAglM, surface.directionDeg, surface.speedKt, surface.gustKt ?? null, ends)
    }
    const heightAglM = unit === 'ft' ? value * M_PER_FT : value
    const w = windAtHeightAglM(levels, heightAglM)
    if (!w) {
      const why = heightAglM > top ? `the profile stops at ${Math.round(unit === 'ft' ? top / M_PER_FT : top).toLocaleString('en-GB')} ${unit}` : 'below the lowest level'
      return empty(label, value, unit, heightAglM, why)
    }
    return row(label, value, unit, heightAglM, w.directionDeg, w.speedKt, null, ends)
  })
}

function row(label: string, value: number, unit: KeyHeightUnit, heightAglM: number, directionDeg: number, speedKt: number,
  gustKt: number | null, ends: readonly { designator: string, trueHeadingDeg: number }[]): KeyHeightRow {
  return {
    label, value, unit, heightAglM, directionDeg, speedKt, gustKt, reason: null,
    components: ends.map((e) => {
      const g = gustKt == null ? null : componentsOf(directionDeg, gustKt, e.trueHeadingDeg)
      return { designator: e.designator, ...componentsOf(directionDeg, speedKt, e.trueHeadingDeg),
        gustHeadwindKt: g?.headwindKt ?? null, gustCrosswindKt: g?.crosswindKt ?? null }
    }),
  }
}

function empty(label: string, value: number, unit: KeyHeightUnit, heightAglM: number, reason: string): KeyHeightRow {
  return { label, value, unit, heightAglM, directionDeg: null, speedKt: null, gustKt: null, components: [], reason }
}
