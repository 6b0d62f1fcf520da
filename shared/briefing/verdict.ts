/**
 * The verdict line of a briefing per runway end: its own limit checks and the airfield-wide ones (layer shear and
 * vector difference touch every end alike), in words a pilot reads at a glance. Plain TypeScript.
 */
import type { LimitCheck } from '../limits'

export interface RunwayVerdict {
  designator: string
  /** Checks exceeded for this end, airfield-wide ones included. */
  exceededCount: number
  nearCount: number
  withinLimits: boolean
  /** "Runway 27: within limits", "Runway 27: 2 limits exceeded". */
  words: string
  /** What was exceeded, in the checks' own words (exceeded first, then near). */
  reasons: string[]
}

export function runwayVerdict(designator: string, checks: readonly Pick<LimitCheck, 'designator' | 'state' | 'message'>[]): RunwayVerdict {
  const mine = checks.filter(c => c.designator === designator || c.designator === null)
  const exceeded = mine.filter(c => c.state === 'exceeded')
  const near = mine.filter(c => c.state === 'near')
  const n = exceeded.length
  const words = n === 0
    ? `Runway ${designator}: within limits${near.length ? ` (${near.length} near ${near.length === 1 ? 'its limit' : 'their limits'})` : ''}`
    : `Runway ${designator}: ${n} ${n === 1 ? 'limit' : 'limits'} exceeded`
  return { designator, exceededCount: n, nearCount: near.length, withinLimits: n === 0, words,
    reasons: [...exceeded, ...near].map(c => c.message) }
}

export interface AirfieldVerdict {
  ends: RunwayVerdict[]
  /** No runway end is within limits (the banner's case); false for an airfield without runway ends. */
  noEndWithinLimits: boolean
  /** The banner's words when no end is within limits, else null. */
  banner: string | null
}

/** The banner's headline; a phone shows only this, the ends being listed just below it. */
export const NO_END_WITHIN_LIMITS = 'No runway end is within limits'

export function airfieldVerdict(designators: readonly string[], checks: readonly Pick<LimitCheck, 'designator' | 'state' | 'message'>[]): AirfieldVerdict {
  const ends = designators.map(d => runwayVerdict(d, checks))
  const none = ends.length > 0 && ends.every(e => !e.withinLimits)
  return {
    ends,
    noEndWithinLimits: none,
    banner: none ? `${NO_END_WITHIN_LIMITS}: every end (${designators.join(', ')}) exceeds at least one limit.` : null,
  }
}
