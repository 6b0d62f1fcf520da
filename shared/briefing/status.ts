/**
 * Where a profile stands at the time a briefing is for (the arrival or departure time, "now" by default), and how
 * old it is. Plain TypeScript: the server puts these into the answer, tests call them directly.
 */

export type ProfileStatus = 'current' | 'expired' | 'upcoming' | 'superseded' | 'withdrawn'

/** "2026-12-02T00:00:00.000Z" → "2026-12-02 00:00Z" (the way Veerline writes a time). */
export function utcMinute(d: Date): string {
  const iso = d.toISOString()
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)}Z`
}

/**
 * Withdrawn and superseded come first (they hold whatever the time); then validity at `at`. `supersededThen`: a
 * newer profile took over the moment `at` (supersession by time: the profile may be in force at other moments).
 */
export function profileStatusAt(p: { status: string, validFrom: Date, validTo: Date }, at: Date, supersededThen = false): ProfileStatus {
  if (p.status === 'withdrawn') return 'withdrawn'
  if (p.status === 'superseded' || supersededThen) return 'superseded'
  if (p.validTo.getTime() < at.getTime()) return 'expired'
  if (p.validFrom.getTime() > at.getTime()) return 'upcoming'
  return 'current'
}

/**
 * The status in words for the chosen time. `chosen` is false when the reader asked for no time (now): then the
 * words say "now"; otherwise they name the time.
 */
export function statusWordsAt(status: ProfileStatus, p: { validFrom: Date, validTo: Date }, at: Date, chosen: boolean): string {
  const when = chosen ? `at ${utcMinute(at)}` : 'now'
  switch (status) {
    case 'current': return chosen ? `Valid at ${utcMinute(at)}` : 'Current: valid now'
    case 'expired': return `Expired ${when}: its validity ended ${utcMinute(p.validTo)}`
    case 'upcoming': return `Not yet valid ${when}: it begins ${utcMinute(p.validFrom)}`
    case 'superseded': return 'Superseded by a newer profile'
    case 'withdrawn': return 'Withdrawn: do not use'
  }
}

/** Minutes after filing past which a briefing warns that its profile is stale (VEERLINE_STALE_AFTER_MIN). */
export const DEFAULT_STALE_AFTER_MIN = 90

/**
 * Ages that mean something: minutes since filing (at `now`), and at the chosen time the age of the data (from its
 * observation time when a coded report gave one, else from filing), stale past `staleAfterMin`.
 */
export function profileAges(p: { createdAt: Date, observedAt?: Date | null }, now: Date, at: Date, staleAfterMin = DEFAULT_STALE_AFTER_MIN) {
  const filedMinutesAgo = Math.floor((now.getTime() - p.createdAt.getTime()) / 60_000)
  const since = p.observedAt ?? p.createdAt
  const ageAtChosenTimeMinutes = Math.floor((at.getTime() - since.getTime()) / 60_000)
  const stale = ageAtChosenTimeMinutes > staleAfterMin
  return {
    filedMinutesAgo,
    observedAt: p.observedAt ? p.observedAt.toISOString() : null,
    ageAtChosenTimeMinutes,
    staleAfterMinutes: staleAfterMin,
    stale,
    staleWords: stale
      ? `Stale: the ${p.observedAt ? 'observation' : 'profile'} is ${ageWords(ageAtChosenTimeMinutes)} old at the chosen time (warning past ${staleAfterMin} min); look for a newer one`
      : null,
  }
}

/** "45 min", "2 h 05 min", "3 d 4 h". */
export function ageWords(minutes: number): string {
  const m = Math.max(0, Math.round(minutes))
  if (m < 60) return `${m} min`
  if (m < 48 * 60) return `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min`
  return `${Math.floor(m / 1440)} d ${Math.floor((m % 1440) / 60)} h`
}
