/**
 * What changed against the profile a newer one superseded: the key figures of both, held against the same limits,
 * and their differences. Plain TypeScript.
 */
import type { LimitCheck } from '../limits'
import type { ProfileAnalysis } from '../wind/types'
import { runwayVerdict } from './verdict'

export interface EndFigures {
  designator: string
  /** Surface headwind (negative = tailwind), null without a surface level. */
  headwindKt: number | null
  /** Surface crosswind (positive = from the right). */
  crosswindKt: number | null
  /** Largest airspeed loss on arrival (600 m down to the ground). */
  arrivalLossKt: number | null
  departureLossKt: number | null
  exceededCount: number
  withinLimits: boolean
}

export interface KeyFigures {
  strongestShearKtPer100ft: number | null
  ends: EndFigures[]
}

export function keyFiguresOf(analysis: Pick<ProfileAnalysis, 'shear' | 'runwayEnds'>, checks: readonly LimitCheck[]): KeyFigures {
  return {
    strongestShearKtPer100ft: analysis.shear.strongestLayer?.shearKtPer100ft ?? null,
    ends: analysis.runwayEnds.map((e) => {
      const v = runwayVerdict(e.designator, checks)
      return {
        designator: e.designator,
        headwindKt: e.surface?.headwindKt ?? null,
        crosswindKt: e.surface?.crosswindKt ?? null,
        arrivalLossKt: e.arrival?.maxAirspeedLossKt ?? null,
        departureLossKt: e.departure?.maxAirspeedLossKt ?? null,
        exceededCount: v.exceededCount,
        withinLimits: v.withinLimits,
      }
    }),
  }
}

const minus = (a: number | null, b: number | null) => (a == null || b == null ? null : a - b)

export interface EndChange {
  designator: string
  before: EndFigures | null
  after: EndFigures
  headwindChangeKt: number | null
  crosswindChangeKt: number | null
  arrivalLossChangeKt: number | null
  /** "within limits" → "2 limits exceeded" and the like; null when the verdict stayed. */
  verdictChange: string | null
}

export interface BriefingChange {
  previousProfileId: number
  strongestShearBeforeKtPer100ft: number | null
  strongestShearAfterKtPer100ft: number | null
  strongestShearChangeKtPer100ft: number | null
  ends: EndChange[]
}

const verdictWords = (e: EndFigures) => (e.withinLimits ? 'within limits' : `${e.exceededCount} ${e.exceededCount === 1 ? 'limit' : 'limits'} exceeded`)

/** The change from `before` (the superseded profile) to `after` (this one), end by end. */
export function briefingChangeOf(previousProfileId: number, before: KeyFigures, after: KeyFigures): BriefingChange {
  return {
    previousProfileId,
    strongestShearBeforeKtPer100ft: before.strongestShearKtPer100ft,
    strongestShearAfterKtPer100ft: after.strongestShearKtPer100ft,
    strongestShearChangeKtPer100ft: minus(after.strongestShearKtPer100ft, before.strongestShearKtPer100ft),
    ends: after.ends.map((a) => {
      const b = before.ends.find(x => x.designator === a.designator) ?? null
      const was = b ? verdictWords(b) : null
      const now = verdictWords(a)
      return {
        designator: a.designator,
        before: b,
        after: a,
        headwindChangeKt: minus(a.headwindKt, b?.headwindKt ?? null),
        crosswindChangeKt: minus(a.crosswindKt, b?.crosswindKt ?? null),
        arrivalLossChangeKt: minus(a.arrivalLossKt, b?.arrivalLossKt ?? null),
        verdictChange: was == null || was === now ? null : `${was} → ${now}`,
      }
    }),
  }
}
