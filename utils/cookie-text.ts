// One short text kept in a cookie, read from a Cookie header (RFC 6265 §4.2: `name=value` pairs joined by "; ").

/** The value of cookie `name` in a Cookie header (or `document.cookie`), URI-decoded; null when it is not there. */
export function cookieValue(header: string | null | undefined, name: string): string | null {
  for (const pair of (header ?? '').split(';')) {
    const at = pair.indexOf('=')
    if (at < 0 || pair.slice(0, at).trim() !== name) continue
    const raw = pair.slice(at + 1).trim()
    let text: string
    try {
      text = decodeURIComponent(raw)
    }
    catch {
      return null
    }
    // Nuxt's useCookie, which kept these values before, wrote a text that reads as a number as JSON ("26" as "\"26\"").
    return /^"[^"\\]*"$/.test(text) ? text.slice(1, -1) : text
  }
  return null
}

/** What to assign to `document.cookie` to keep `value` under `name` for `maxAgeS` seconds, site-wide, SameSite=Lax. */
export function cookieAssignment(name: string, value: string, maxAgeS: number): string {
  return `${name}=${encodeURIComponent(value)}; Max-Age=${Math.round(maxAgeS)}; Path=/; SameSite=Lax`
}
