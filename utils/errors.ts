// The message a person can act on, from a failed $fetch: the server's statusMessage and its field issues.
export function fetchFailure(err: unknown, fallback: string): { message: string, issues: { field: string, message: string, line?: number, index?: number }[] } {
  const e = err as { data?: { statusMessage?: string, data?: { issues?: { field: string, message: string, line?: number, index?: number }[] } }, statusMessage?: string }
  return { message: e.data?.statusMessage || e.statusMessage || fallback, issues: e.data?.data?.issues ?? [] }
}

/** A UTC instant shown with its Z: 2026-05-01 06:00Z. */
export function utcShort(iso: string | null | undefined): string {
  return iso ? `${iso.slice(0, 10)} ${iso.slice(11, 16)}Z` : '—'
}
