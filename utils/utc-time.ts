// Times are typed and shown as UTC on a 24-hour clock, "2026-03-01 06:00Z" (a browser date picker would use its locale).
export const UTC_TIME_PLACEHOLDER = '2026-03-01 06:00Z'

/** "2026-03-01T06:00:00Z" → "2026-03-01 06:00Z"; `blank` for nothing. */
export function utcShort(iso: string | undefined | null, blank = '—'): string {
  return iso ? `${iso.slice(0, 10)} ${iso.slice(11, 16)}Z` : blank
}

/** The same with seconds, for delivery and message logs: "2026-03-01 06:00:07Z". */
export function utcSeconds(iso: string | undefined | null, blank = '—'): string {
  return iso ? `${iso.slice(0, 10)} ${iso.slice(11, 19)}Z` : blank
}

/** "2026-03-01 06:00Z", "2026-03-01T0600" … → "2026-03-01T06:00:00Z"; null when it is not such a time. */
export function parseUtcText(typed: string): string | null {
  const m = typed.trim().match(/^(\d{4}-\d{2}-\d{2})[ T](\d{2}):?(\d{2})\s*Z?$/i)
  return m ? `${m[1]}T${m[2]}:${m[3]}:00Z` : null
}
