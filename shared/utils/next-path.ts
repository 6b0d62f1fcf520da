/**
 * The page to go to after signing in, when `next` is a path on this site; null otherwise. `//host/x` and `/\host`
 * are network-path references that browsers resolve to another host (RFC 3986 §4.2, WHATWG URL parsing treats `\`
 * like `/`), so they are refused, as is anything that does not stay on our origin once resolved.
 */
export function safeNextPath(next: unknown): string | null {
  if (typeof next !== 'string' || !next.startsWith('/') || next.length > 2000) return null
  if (/^\/[/\\]/.test(next) || [...next].some(ch => ch.charCodeAt(0) < 0x20 || ch.charCodeAt(0) === 0x7F)) return null
  try {
    const base = 'http://veerline.invalid'
    const url = new URL(next, base)
    return url.origin === base ? `${url.pathname}${url.search}${url.hash}` : null
  }
  catch {
    return null
  }
}
