/**
 * Supersession by time, as plain functions: a new profile supersedes an active one only for the time they share;
 * the older one stays in force for the rest of its validity. Intervals are half-open [from, to).
 *
 * The one rule every reader uses (briefings, receipts, alert evaluation): a profile is superseded at a moment when
 * one of its supersession records covers that moment. Its status becomes 'superseded' once nothing of its validity
 * from now on is left in force (the past stays as it was: it was in force then).
 */
export interface Interval {
  from: Date
  to: Date
  /** The newer profile that took this interval over, where known. */
  byId?: number
}

export interface ProfileSpan {
  id: number
  validFrom: Date
  validTo: Date
  /** The parts of its validity already superseded by newer profiles. */
  superseded: Interval[]
}

export interface SupersessionPlan {
  /** One record per older profile: superseded by the new one over [fromAt, toAt). */
  records: { profileId: number, fromAt: Date, toAt: Date }[]
  /** Older profiles now superseded for the whole of their validity (their status becomes 'superseded'). */
  fullySuperseded: number[]
  /** Older profiles that stay in force for part of their validity. */
  partlySuperseded: number[]
}

const t = (d: Date) => d.getTime()

/** The union of intervals, sorted and merged (touching intervals join). */
export function mergeIntervals(intervals: Interval[]): Interval[] {
  const sorted = intervals.filter(i => t(i.to) > t(i.from)).sort((a, b) => t(a.from) - t(b.from))
  const out: Interval[] = []
  for (const i of sorted) {
    const last = out[out.length - 1]
    if (last && t(i.from) <= t(last.to)) {
      if (t(i.to) > t(last.to)) last.to = i.to
    }
    else {
      out.push({ from: i.from, to: i.to })
    }
  }
  return out
}

/** Whether the intervals together cover [from, to) without a gap. */
export function covers(intervals: Interval[], from: Date, to: Date): boolean {
  let reached = t(from)
  for (const i of mergeIntervals(intervals)) {
    if (t(i.from) > reached) break
    reached = Math.max(reached, t(i.to))
    if (reached >= t(to)) return true
  }
  return reached >= t(to)
}

/** The part of a validity that is still ahead at `now`; the whole validity when all of it is past. */
function remainingOf(p: ProfileSpan, now: Date): Interval {
  const from = new Date(Math.max(t(p.validFrom), t(now)))
  return t(from) < t(p.validTo) ? { from, to: p.validTo } : { from: p.validFrom, to: p.validTo }
}

/** Whether some moment of its validity from `now` on is not superseded (all of it, for a profile wholly past). */
export function inForceFrom(p: ProfileSpan, now: Date): boolean {
  const rest = remainingOf(p, now)
  return !covers(p.superseded, rest.from, rest.to)
}

/**
 * What filing a profile valid over [validFrom, validTo) at `now` does to the active profiles that overlap it: one
 * record each for the time they share; wholly superseded are those with nothing left in force from `now` on.
 */
export function planSupersession(validFrom: Date, validTo: Date, overlapping: ProfileSpan[], now: Date): SupersessionPlan {
  const plan: SupersessionPlan = { records: [], fullySuperseded: [], partlySuperseded: [] }
  for (const p of overlapping) {
    const fromAt = new Date(Math.max(t(p.validFrom), t(validFrom)))
    const toAt = new Date(Math.min(t(p.validTo), t(validTo)))
    if (t(toAt) <= t(fromAt)) continue
    plan.records.push({ profileId: p.id, fromAt, toAt })
    if (!inForceFrom({ ...p, superseded: [...p.superseded, { from: fromAt, to: toAt }] }, now)) plan.fullySuperseded.push(p.id)
    else plan.partlySuperseded.push(p.id)
  }
  return plan
}

/** The supersession interval covering a moment (the newest one when several do), or null. */
export function supersededAt(p: Pick<ProfileSpan, 'superseded'>, at: Date): Interval | null {
  let found: Interval | null = null
  for (const i of p.superseded) {
    if (t(i.from) <= t(at) && t(at) < t(i.to) && (!found || (i.byId ?? 0) > (found.byId ?? 0))) found = i
  }
  return found
}

/** Whether a profile is in force at a moment: valid then and not superseded then. */
export function inForceAt(p: ProfileSpan, at: Date): boolean {
  return t(p.validFrom) <= t(at) && t(at) < t(p.validTo) && supersededAt(p, at) === null
}
